import knexFactory from 'knex';
import { createPgPool } from './lib/pg-pool.js';
import { startHeartbeat } from './heartbeat.js';
import { createTwinRegistry, type SwapEvent } from './registry/twin-registry.js';
import { createSampleEmitter, createTwinService } from './twin/index.js';

/**
 * The simulator process. It keeps every loop's active model version (the registry, swapped at the
 * next sample boundary when a version is activated), steps the twins of the loops it leases (the
 * twin service, src/twin/), emits their samples through the socket.io PostgreSQL adapter, and
 * reports a heartbeat with what it holds and steps.
 */
const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) throw new Error('DATABASE_URL is required for the simulator');
const heartbeatMs = Number(process.env.SIMULATOR_HEARTBEAT_MS ?? 5000);
// the twins' ticks and lease cycles, the registry and the heartbeat share it
const db = knexFactory({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 6 } });

const describeSwap = (e: SwapEvent) =>
  `${e.loopTag}: version ${e.fromVersion ?? '—'} → ${e.toVersion ?? '—'} at sample ${e.k}; ${e.reason}`;
const registry = createTwinRegistry({
  db,
  databaseUrl,
  log: (line) => console.log(`simulator registry: ${line}`),
  onSwap: (event) => console.log(`simulator twin swap: ${describeSwap(event)}`),
});
await registry.start();

// the socket.io adapter keeps one of these connections for its LISTEN
const socketPool = createPgPool(databaseUrl, 4, (error) => console.error(`simulator socket pool: ${error.message}`));
const emitter = createSampleEmitter(socketPool);
const twins = createTwinService({
  db,
  models: registry,
  emitter,
  log: (line) => console.log(`simulator twin: ${line}`),
});
await twins.start();

const heartbeat = startHeartbeat(db, {
  intervalMs: heartbeatMs,
  details: () => ({ twins: registry.size(), ...twins.stats() }),
});
await heartbeat.first;
console.log(
  `simulator ${heartbeat.instance} running with ${registry.size()} twins, ${twins.stats().leased} loops leased; heartbeat every ${heartbeatMs} ms`,
);

let stopping = false;
/** Saves every twin and gives its leases back, so another simulator takes the loops over at once. */
const stop = () => {
  if (stopping) return;
  stopping = true;
  heartbeat.stop();
  void twins
    .stop()
    .catch((error: Error) =>
      console.error(`simulator: stopping the twins failed (${error.message}); their leases expire by themselves`),
    )
    .then(() => emitter.close())
    .then(() => socketPool.end())
    .then(() => registry.stop())
    .then(() => db.destroy())
    .then(() => process.exit(0));
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
