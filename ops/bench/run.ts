import { printBenchTable, runEngineBench } from './engine-bench.js';

/**
 * npm run bench: every speed and memory target of the product, each measured against a reference
 * taken in the same run, printed as one table. Targets are reported, never asserted in tests.
 */
console.log('Shadowloop benchmarks (2 cores; close other work for stable numbers)\n');
printBenchTable(runEngineBench());
