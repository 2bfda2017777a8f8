import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { pino } from 'pino';
import { createApp } from '../../api/src/app.js';
import { loadConfig } from '../../api/src/config/config.js';
import { createDb, type Db } from '../../api/src/db/knex.js';
import { createTwinPublisher } from '../../api/src/realtime/publisher.js';
import { createRealtime } from '../../api/src/realtime/realtime.js';
import { ensureDatabase, migrateAndSeed, withDatabase } from '../lib/database.js';
import { freePort } from '../lib/ports.js';
import { startCluster } from '../lib/postgres.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export interface BenchStack {
  url: string;
  databaseUrl: string;
  db: Db;
  pool: pg.Pool;
  stop(): Promise<void>;
}

/**
 * A throwaway PostgreSQL cluster (a fresh folder under .data/, a free loopback port, durable like a
 * site installation), migrated and seeded, and the api in this process on a free port. stop()
 * closes the api, stops the cluster and removes its folder.
 */
export async function startBenchStack(): Promise<BenchStack> {
  const dir = path.join(root, '.data', `bench-pg-${process.pid}`);
  const cluster = startCluster(dir, await freePort(), { durable: true });
  const remove = () => {
    cluster.stop();
    fs.rmSync(dir, { recursive: true, force: true });
    fs.rmSync(`${dir}.password`, { force: true });
  };
  try {
    await ensureDatabase(cluster.adminUrl(), 'shadowloop_bench');
    const databaseUrl = withDatabase(cluster.adminUrl(), 'shadowloop_bench');
    await migrateAndSeed(databaseUrl, { seed: true });
    const config = loadConfig({
      PORT: '0',
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'bench-session-secret-0123456789-abcdef',
      LOG_LEVEL: 'silent',
      OIDC_ISSUER: 'http://127.0.0.1:9',
      OIDC_CLIENT_ID: 'bench',
      OIDC_CLIENT_SECRET: 'bench',
      // The latency run posts one request per loop per second from one sender.
      INGEST_RATE_LIMIT_PER_MINUTE: '10000000',
    });
    const pool = new pg.Pool({ connectionString: databaseUrl, max: 10 });
    const db = createDb(databaseUrl, 10);
    const logger = pino({ level: 'silent' });
    const publisher = createTwinPublisher();
    const server = http.createServer(createApp({ config, db, pool, logger, version: 'bench', publisher }));
    const realtime = createRealtime(server, { config, db, pool, logger, publisher });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    return {
      url,
      databaseUrl,
      db,
      pool,
      async stop() {
        server.closeAllConnections();
        await realtime.close();
        await db.destroy();
        await pool.end();
        remove();
      },
    };
  } catch (error) {
    remove();
    throw error;
  }
}
