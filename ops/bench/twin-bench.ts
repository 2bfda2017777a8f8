/**
 * Stepping benchmark: 2,000 loops of 10 states at a 1 s sample period on one simulator process,
 * with their readings arriving every second, predictions written and samples emitted through the
 * socket.io PostgreSQL adapter, as in production. Measures the process's CPU share of one core
 * (process.cpuUsage over the window) and how late each tick finished after its slot's processing
 * time. Runs on a throwaway PostgreSQL cluster of its own. `runTwinBench()` returns the rows;
 * run directly with `node --import tsx ops/bench/twin-bench.ts`.
 */
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import knexFactory from 'knex';
import { createTwinRegistry } from '../../simulator/src/registry/twin-registry.js';
import { createSampleEmitter, createTwinService, type TickReport } from '../../simulator/src/twin/index.js';
import { ensureDatabase, migrateAndSeed, withDatabase } from '../lib/database.js';
import { freePort } from '../lib/ports.js';
import { startCluster } from '../lib/postgres.js';
import { printBenchTable, type BenchRow } from './engine-bench.js';
import { createBenchLoops, insertBenchReadings, type BenchPlantShape } from './twin-bench-plant.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SHAPE: BenchPlantShape = { loops: 2000, states: 10, inputs: 2, outputs: 2, samplePeriodS: 1 };
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? NaN;

/** Feeds every loop's reading shortly after each slot boundary until stopped. */
function startFeeder(db: knexFactory.Knex): () => Promise<void> {
  let running = true;
  const done = (async () => {
    while (running) {
      const k = Math.floor(Date.now() / 1000) + 1;
      await sleep(k * 1000 + 50 - Date.now());
      await insertBenchReadings(db, SHAPE, k);
    }
  })();
  return async () => {
    running = false;
    await done;
  };
}

async function measure(databaseUrl: string, warmUpS: number, windowS: number) {
  const db = knexFactory({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 6 } });
  await createBenchLoops(db, SHAPE);
  const stopFeeder = startFeeder(db);
  const registry = createTwinRegistry({ db, databaseUrl, log: () => undefined });
  await registry.start();
  const socketPool = createPgPool(databaseUrl, 4);
  const emitter = createSampleEmitter(socketPool);
  const ticks: TickReport[] = [];
  let recording = false;
  const service = createTwinService({
    db,
    models: registry,
    emitter,
    log: () => undefined,
    onTick: (r) => void (recording && ticks.push(r)),
  });
  await service.start();
  await sleep(warmUpS * 1000);
  recording = true;
  const cpu = process.cpuUsage();
  const started = performance.now();
  await sleep(windowS * 1000);
  const used = process.cpuUsage(cpu);
  const elapsedS = (performance.now() - started) / 1000;
  recording = false;
  await service.stop();
  await emitter.close();
  await socketPool.end();
  await registry.stop();
  await stopFeeder();
  await db.destroy();
  return { used, elapsedS, ticks };
}

/** Runs the measurement on its own cluster (removed afterwards) and returns the rows. */
export async function runTwinBench(windowS = 30): Promise<BenchRow[]> {
  const dataDir = path.join(root, '.data', `pg-bench-${process.pid}`);
  const cluster = startCluster(dataDir, await freePort(), { durable: false });
  try {
    await ensureDatabase(cluster.adminUrl(), 'bench');
    const databaseUrl = withDatabase(cluster.adminUrl(), 'bench');
    await migrateAndSeed(databaseUrl, { seed: false });
    const { used, elapsedS, ticks } = await measure(databaseUrl, 8, windowS);
    const cpuS = (used.user + used.system) / 1e6;
    const share = (100 * cpuS) / elapsedS;
    const slots = ticks.reduce((s, t) => s + t.slots, 0);
    const expected = SHAPE.loops * Math.round(elapsedS / SHAPE.samplePeriodS);
    const lags = ticks.map((t) => t.maxLagMs).sort((a, b) => a - b);
    const durations = ticks.map((t) => t.durationMs).sort((a, b) => a - b);
    const p99 = percentile(lags, 0.99);
    return [
      {
        name: `twin stepping, ${SHAPE.loops} loops × ${SHAPE.states} states at ${SHAPE.samplePeriodS} s: CPU share of one core`,
        target: '< 30 %',
        measured: `${share.toFixed(1)} % (${cpuS.toFixed(2)} s CPU in ${elapsedS.toFixed(1)} s)`,
        met: share < 30,
      },
      {
        name: 'twin stepping: keeps up with real time (tick done after slot + grace)',
        target: 'every slot; lag p99 < 1 s',
        measured: `${slots} of ~${expected} slots; lag p50 ${percentile(lags, 0.5).toFixed(0)} ms, p99 ${p99.toFixed(0)} ms, max ${lags[lags.length - 1]?.toFixed(0)} ms`,
        met: slots >= 0.98 * expected && p99 < 1000,
      },
      {
        name: 'twin tick: 1 readings query + 1 INSERT of predictions + samples emitted',
        target: 'information',
        measured: `${ticks.length} ticks; duration p50 ${percentile(durations, 0.5).toFixed(0)} ms, p99 ${percentile(durations, 0.99).toFixed(0)} ms`,
        met: null,
      },
    ];
  } finally {
    cluster.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
    fs.rmSync(`${dataDir}.password`, { force: true });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printBenchTable(await runTwinBench(Number(process.argv[2] ?? 30)));
}
