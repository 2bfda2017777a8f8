import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type pg from 'pg';
import { createDb, type Db } from '../../api/src/db/knex.js';
import { ensureDatabase, migrateAndSeed, withDatabase } from '../lib/database.js';
import { freePort } from '../lib/ports.js';
import { startCluster } from '../lib/postgres.js';
import { startService, stopServices, waitForHttp } from '../lib/processes.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

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
 * site installation), migrated and seeded, and the api as its own process (api/src/index.ts, as
 * npm start runs it) on a free port; `db` and `pool` are this process's connections for setting up
 * data and for the COPY reference. stop() stops the api, stops the cluster and removes its folder.
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
    const db = createDb(databaseUrl, 4);
    const pool = createPgPool(databaseUrl, 4);
    // the api in a process of its own, as in a site installation: the bench's clients do not share its thread
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const api = startService(
      'bench-api',
      'api/src/index.ts',
      {
        PORT: String(port),
        PUBLIC_URL: url,
        DATABASE_URL: databaseUrl,
        SESSION_SECRET: 'bench-session-secret-0123456789-abcdef',
        LOG_LEVEL: 'silent',
        OIDC_ISSUER: 'http://127.0.0.1:9',
        OIDC_CLIENT_ID: 'bench',
        OIDC_CLIENT_SECRET: 'bench',
        // one sender posts for every loop; the mail sender and the sweep have nothing to do here
        INGEST_RATE_LIMIT_PER_MINUTE: '10000000',
        ALERT_WORKERS: 'false',
      },
      root,
    );
    await waitForHttp(`${url}/api/health`, 60_000);
    return {
      url,
      databaseUrl,
      db,
      pool,
      async stop() {
        await stopServices([api], 5000);
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
