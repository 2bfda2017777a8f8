/**
 * Live-twin benchmark: HTTP ingest against a raw COPY of the same rows, the downsampled week trend
 * against the raw fetch, and reading → twin:sample latency over many loops. It starts its own
 * throwaway PostgreSQL cluster and the api as its own process (loopback only), and removes both.
 * `runIngestBench()` returns rows for ops/bench/run.ts; run directly it prints them.
 * BENCH_INGEST_SECONDS (default 60), BENCH_LATENCY_LOOPS (200), BENCH_LATENCY_SECONDS (20),
 * BENCH_LATENCY_WIDE_LOOPS (2000), BENCH_LATENCY_WIDE_PERIOD_S (10), BENCH_LATENCY_WIDE_SECONDS (40),
 * BENCH_ALERT_LOOPS (2000), BENCH_ALERT_PERIOD_S (10).
 */
import { pathToFileURL } from 'node:url';
import { createAccessToken } from '../../api/src/modules/access-tokens/access-tokens.service.js';
import { benchToken, createBenchLoops, insertBenchPredictions } from './bench-data.js';
import { startBenchStack, type BenchStack } from './bench-stack.js';
import { printBenchTable, type BenchRow } from './engine-bench.js';
import { copyRate, httpIngestRate } from './ingest-throughput.js';
import { alertLatency, prepareAlertLoops } from './alert-latency.js';
import { sampleLatency } from './sample-latency.js';
import { fillWeek, seriesSpeed } from './series-speed.js';

const setting = (name: string, fallback: number) => Number(process.env[name] ?? fallback);
const k = (value: number) => `${(value / 1000).toFixed(1)} k`;
const STREAMS = 8;

async function ingestRows(stack: BenchStack): Promise<BenchRow[]> {
  const seconds = setting('BENCH_INGEST_SECONDS', 60);
  const loops = await createBenchLoops(stack.db, STREAMS, 'BENCH-IN');
  const token = await benchToken(stack.db, loops, 'bench ingest');
  // Slots from 20 days back, with the twin's predictions stored ahead as the simulator would.
  const fromK = Math.floor(Date.now() / 1000) - 20 * 86_400;
  await insertBenchPredictions(stack.db, loops, fromK, Math.ceil((seconds * 60_000) / STREAMS));
  // Both runs start from a clean checkpoint, so neither pays for the other's writes.
  await stack.db.raw('CHECKPOINT');
  const http = await httpIngestRate(stack.url, token, loops, fromK, seconds);
  const copyLoops = await createBenchLoops(stack.db, STREAMS, 'BENCH-CP');
  await stack.db.raw('CHECKPOINT');
  const copy = await copyRate(stack.pool, copyLoops, fromK, Math.round(http.stored / STREAMS));
  const ratio = http.perSecond / copy.perSecond;
  return [
    {
      name: `HTTP ingest, batches of 1,000, ${STREAMS} loops in parallel, ${http.elapsed.toFixed(0)} s (residuals and tracking included)`,
      target: '≥ 30,000 readings/s',
      measured: `${k(http.perSecond)} readings/s (${k(http.stored)} stored)`,
      met: http.perSecond >= 30_000,
    },
    {
      name: 'HTTP ingest against raw COPY of the same rows into readings',
      target: '≥ 25 % of COPY',
      measured: `${(100 * ratio).toFixed(0)} % (COPY ${k(copy.perSecond)} rows/s)`,
      met: ratio >= 0.25,
    },
  ];
}

async function seriesRows(stack: BenchStack): Promise<BenchRow[]> {
  const [loopId] = await createBenchLoops(stack.db, 1, 'BENCH-SE');
  const week = await fillWeek(stack.db, loopId);
  const speed = await seriesSpeed(stack.url, await personalToken(stack), stack.db, loopId, week);
  return [
    {
      name: `GET …/series, 7 days of 1 s readings and predictions (604,800 rows each) → ${speed.points} points`,
      target: '< 300 ms',
      measured:
        `${speed.downsampledMs.toFixed(0)} ms median (first request ${speed.firstMs.toFixed(0)} ms; ` +
        `raw fetch of all ${k(speed.rows)} rows ${speed.rawMs.toFixed(0)} ms)`,
      met: speed.downsampledMs < 300,
    },
  ];
}

/** Trends are for signed-in people: a personal token of the demo engineer. */
async function personalToken(stack: BenchStack): Promise<string> {
  const user = await stack
    .db('users')
    .where({ email: 'engineer@quillmere.example' })
    .first<{ id: string; email: string }>('id', 'email');
  return (await createAccessToken(stack.db, user, 'bench')).token;
}

async function latencyRows(stack: BenchStack): Promise<BenchRow[]> {
  const count = setting('BENCH_LATENCY_LOOPS', 200);
  const seconds = setting('BENCH_LATENCY_SECONDS', 20);
  const loops = await createBenchLoops(stack.db, count, 'BENCH-LT');
  const bridge = await benchToken(stack.db, loops, 'bench latency');
  const result = await sampleLatency(stack.url, { bridge, watcher: await personalToken(stack) }, loops, seconds);
  const lost = result.sent - result.received;
  return [
    {
      name: `reading posted → twin:sample at a watching client, ${count} loops × 1 reading/s, ${seconds} s after 5 s warm-up`,
      target: 'p99 < 500 ms',
      measured:
        `p50 ${result.p50.toFixed(0)} ms, p99 ${result.p99.toFixed(0)} ms` +
        `${lost ? `, ${lost} of ${result.sent} not seen` : ''}${result.failures ? `, ${result.failures} posts failed` : ''}`,
      met: result.p99 < 500 && lost === 0 && result.failures === 0,
    },
  ];
}

/** The same latency with 2,000 loops, at a 10 s sample period (200 posts/s from one bridge). */
async function wideLatencyRows(stack: BenchStack): Promise<BenchRow[]> {
  const count = setting('BENCH_LATENCY_WIDE_LOOPS', 2000);
  const periodS = setting('BENCH_LATENCY_WIDE_PERIOD_S', 10);
  const seconds = setting('BENCH_LATENCY_WIDE_SECONDS', 40);
  const loops = await createBenchLoops(stack.db, count, 'BENCH-LW', periodS);
  const bridge = await benchToken(stack.db, loops, 'bench latency, many loops');
  const result = await sampleLatency(
    stack.url,
    { bridge, watcher: await personalToken(stack) },
    loops,
    seconds,
    periodS,
  );
  const lost = result.sent - result.received;
  return [
    {
      name: `reading posted → twin:sample at a watching client, ${count} loops × 1 reading per ${periodS} s (${Math.round(count / periodS)} posts/s), ${seconds} s`,
      target: 'p99 < 500 ms',
      measured:
        `p50 ${result.p50?.toFixed(0)} ms, p99 ${result.p99?.toFixed(0)} ms` +
        `${lost ? `, ${lost} of ${result.sent} not seen` : ''}${result.failures ? `, ${result.failures} posts failed` : ''}`,
      met: result.p99 < 500 && lost === 0 && result.failures === 0,
    },
  ];
}

async function alertRows(stack: BenchStack): Promise<BenchRow[]> {
  const count = setting('BENCH_ALERT_LOOPS', 2000);
  const periodS = setting('BENCH_ALERT_PERIOD_S', 10);
  const periods = { healthy: 3, spread: 6 };
  const loops = await createBenchLoops(stack.db, count, 'BENCH-AL', periodS);
  const fromK = Math.ceil(Date.now() / (periodS * 1000)) + 2;
  await prepareAlertLoops(stack.db, loops, periodS, fromK, periods.healthy + periods.spread + 3);
  const bridge = await benchToken(stack.db, loops, 'bench alerts');
  const result = await alertLatency(
    stack.url,
    { bridge, watcher: await personalToken(stack) },
    loops,
    periodS,
    fromK,
    periods,
  );
  const missing = result.expected - result.received;
  return [
    {
      name:
        `reading posted → alert:raised at a client, ${count} loops × 1 reading per ${periodS} s ` +
        `(${Math.round(count / periodS)} posts/s), a band fault in every loop, onsets spread over ` +
        `${periods.spread * periodS} s (${Math.round(count / (periods.spread * periodS))} raises/s)`,
      target: 'p99 < 1 s',
      measured:
        `p50 ${result.p50?.toFixed(0)} ms, p99 ${result.p99?.toFixed(0)} ms, ${result.received} of ${result.expected} raised` +
        `${result.falseAlerts ? `, ${result.falseAlerts} raised early` : ''}${result.failures ? `, ${result.failures} posts failed` : ''}`,
      met: result.p99 < 1000 && missing === 0 && result.falseAlerts === 0 && result.failures === 0,
    },
  ];
}

/** Runs every live-twin measurement on its own cluster and api; returns one row per target. */
export async function runIngestBench(): Promise<BenchRow[]> {
  const stack = await startBenchStack();
  try {
    // Quietest first: the latency on a fresh cluster, then the week trend, then the bulk ingest.
    const latency = [...(await latencyRows(stack)), ...(await wideLatencyRows(stack))];
    const alerts = await alertRows(stack);
    const series = await seriesRows(stack);
    return [...(await ingestRows(stack)), ...series, ...latency, ...alerts];
  } finally {
    await stack.stop();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printBenchTable(await runIngestBench());
}
