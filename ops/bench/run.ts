import { printBenchTable, runEngineBench } from './engine-bench.js';
import { runIngestBench } from './ingest-bench.js';
import { runTwinBench } from './twin-bench.js';
import { runBacktestBench } from './backtest-bench.js';

/**
 * npm run bench: every speed and memory target of the product, each measured against a reference
 * taken in the same run, printed as one table. Targets are reported, never asserted in tests.
 */
console.log('Shadowloop benchmarks (2 cores; close other work for stable numbers)\n');
const engine = runEngineBench();
console.log('Live twin and alerts: a throwaway PostgreSQL cluster and the api as its own process (about 7 minutes)…\n');
const ingest = await runIngestBench();
console.log('Stepping: 2,000 twins on another throwaway cluster (about a minute)…\n');
printBenchTable([...engine, ...ingest, ...(await runTwinBench()), ...(await runBacktestBench())]);
