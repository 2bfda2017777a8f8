import http from 'node:http';
import { pino } from 'pino';
import pg from 'pg';
import { createApp } from './app.js';
import { loadConfig } from './config/config.js';
import { createDb } from './db/knex.js';

/** The api process: parse config, connect, listen, shut down cleanly on SIGTERM. */
const config = loadConfig();
const logger = pino({ level: config.LOG_LEVEL, name: 'api' });
const pool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 10 });
const db = createDb(config.DATABASE_URL);
const app = createApp({ config, db, pool, logger, version: process.env.npm_package_version ?? '0.1.0' });
const server = http.createServer(app);
server.listen(config.PORT, config.HOST, () => logger.info(`api listening on ${config.PUBLIC_URL}`));

async function shutdown(): Promise<void> {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await db.destroy();
  await pool.end();
  process.exit(0);
}
process.on('SIGTERM', () => void shutdown());
process.on('SIGINT', () => void shutdown());
