import http from 'node:http';
import { listenForCacheNotices } from '../../api/src/workers/cache-notices.js';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import { createApp } from '../../api/src/app.js';
import { loadConfig } from '../../api/src/config/config.js';
import { createDb, type Db } from '../../api/src/db/knex.js';
import { createTwinPublisher } from '../../api/src/realtime/publisher.js';
import { createRealtime } from '../../api/src/realtime/realtime.js';
import { startAlertWorkers, type AlertWorkers } from '../../api/src/workers/alert-workers.js';
import { startBacktestWorker, type BacktestWorker } from '../../api/src/workers/backtest-worker.js';
import { freePort } from '../../ops/lib/ports.js';
import type { StackInfo } from './test-env.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

export interface RunningApi {
  url: string;
  /** The alert workers (mail sender, sweep), unless ALERT_WORKERS was 'false'. */
  workers: AlertWorkers | null;
  /** The backtest worker, unless BACKTEST_WORKERS was 'false'. */
  backtests: BacktestWorker | null;
  /** The api's own database handle: tests listen to its statements (knex 'query' events). */
  db: Db;
  close(): Promise<void>;
}

/** The real api, in this process, on a free port, against the run's throwaway database. */
export async function startApi(stack: StackInfo, env: Record<string, string> = {}): Promise<RunningApi> {
  // the port is chosen first: links in alert e-mails are built from PUBLIC_URL
  const port = await freePort();
  const config = loadConfig({
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    DATABASE_URL: stack.databaseUrl,
    SESSION_SECRET: 'integration-test-session-secret-0123456789',
    OIDC_ISSUER: stack.idpIssuer,
    OIDC_CLIENT_ID: stack.clientId,
    OIDC_CLIENT_SECRET: stack.clientSecret,
    SMTP_PORT: String(stack.smtpPort),
    DEV_MAILBOX: 'true',
    LOG_LEVEL: 'silent',
    SIGN_IN_RATE_LIMIT_PER_MINUTE: '1000',
    ...env,
  });
  const pool = createPgPool(config.DATABASE_URL, 5);
  const db = createDb(config.DATABASE_URL, 5);
  const logger = pino({ level: 'silent' });
  const publisher = createTwinPublisher();
  const app = createApp({ config, db, pool, logger, version: 'test', publisher });
  const server = http.createServer(app);
  const realtime = createRealtime(server, { config, db, pool, logger, publisher });
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', resolve));
  const workers = config.ALERT_WORKERS ? startAlertWorkers({ db, config, logger, publisher }) : null;
  const backtests = config.BACKTEST_WORKERS ? startBacktestWorker({ db, pool, config, logger }) : null;
  const cacheNotices = listenForCacheNotices(pool, logger);
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    url,
    workers,
    backtests,
    db,
    close: async () => {
      server.closeAllConnections();
      await workers?.stop();
      await backtests?.stop();
      await cacheNotices.stop();
      await realtime.close();
      await db.destroy();
      await pool.end();
    },
  };
}
