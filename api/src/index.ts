import http from 'node:http';
import { listenForCacheNotices } from './workers/cache-notices.js';
import { pino } from 'pino';
import { createPgPool } from './lib/pg-pool.js';
import { createApp } from './app.js';
import { loadConfig } from './config/config.js';
import { createDb } from './db/knex.js';
import { createPartitionKeeper } from './modules/readings/partitions.js';
import { createTwinPublisher } from './realtime/publisher.js';
import { createRealtime } from './realtime/realtime.js';
import { startAlertWorkers } from './workers/alert-workers.js';
import { startBacktestWorker } from './workers/backtest-worker.js';

/** The api process: parse config, connect, listen, shut down cleanly on SIGTERM. */
const config = loadConfig();
const logger = pino({ level: config.LOG_LEVEL, name: 'api' });
const pool = createPgPool(config.DATABASE_URL, 10, (error) =>
  logger.warn({ err: error }, 'an idle database connection was closed by the server'),
);
const db = createDb(config.DATABASE_URL);
const publisher = createTwinPublisher();
const partitions = createPartitionKeeper(db);
const app = createApp({
  config,
  db,
  pool,
  logger,
  version: process.env.npm_package_version ?? '0.1.0',
  publisher,
  partitions,
});
const server = http.createServer(app);
const realtime = createRealtime(server, { config, db, pool, logger, publisher });
const stopPartitionUpkeep = partitions.startUpkeep(logger);
const workers = config.ALERT_WORKERS ? startAlertWorkers({ db, config, logger, publisher }) : null;
const backtests = config.BACKTEST_WORKERS ? startBacktestWorker({ db, pool, config, logger }) : null;
const cacheNotices = listenForCacheNotices(pool, logger);
server.listen(config.PORT, config.HOST, () => logger.info(`api listening on ${config.PUBLIC_URL}`));

let stopping = false;
// SIGINT reaches every process of a terminal's group and the supervisor then sends SIGTERM: once is enough.
async function shutdown(): Promise<void> {
  if (stopping) return;
  stopping = true;
  stopPartitionUpkeep();
  server.closeAllConnections();
  await workers?.stop();
  await backtests?.stop();
  await cacheNotices.stop();
  await realtime.close();
  await db.destroy();
  await pool.end();
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown());
process.on('SIGINT', () => void shutdown());
