import knexFactory from 'knex';
import { startHeartbeat } from './heartbeat.js';

/**
 * The simulator process. For now it reports a heartbeat; the stepping service of the live twin
 * (src/twin/) runs here once loops have active model versions.
 */
const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) throw new Error('DATABASE_URL is required for the simulator');
const db = knexFactory({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 4 } });
const heartbeat = startHeartbeat(db, { intervalMs: Number(process.env.SIMULATOR_HEARTBEAT_MS ?? 5000) });
await heartbeat.first;
console.log(`simulator ${heartbeat.instance} running; heartbeat every ${process.env.SIMULATOR_HEARTBEAT_MS ?? 5000} ms`);

const stop = () => {
  heartbeat.stop();
  void db.destroy().then(() => process.exit(0));
};
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
