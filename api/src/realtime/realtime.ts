import type http from 'node:http';
import { createAdapter } from '@socket.io/postgres-adapter';
import type pg from 'pg';
import type { Logger } from 'pino';
import { Server } from 'socket.io';
import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import type { createTwinPublisher } from './publisher.js';
import type { RealtimeServer } from './realtime-types.js';
import { listenForRevocations } from './access-revocation.js';
import { authenticateSockets } from './socket-auth.js';
import { registerWatchHandlers } from './watch-handlers.js';
import { createPgPool } from '../lib/pg-pool.js';

export interface RealtimeDeps {
  config: Config;
  db: Db;
  /** The session store's pool (the same sessions as the HTTP api). */
  pool: pg.Pool;
  logger: Logger;
  publisher: ReturnType<typeof createTwinPublisher>;
}

/**
 * socket.io on the api's HTTP server, with the PostgreSQL adapter so that every api process and
 * the simulator's headless server share rooms and broadcasts. The adapter holds one connection
 * for LISTEN on its own small pool. close() disconnects the sockets, closes the adapter and the
 * HTTP server (io.close does all three), then ends the adapter's pool.
 */
export function createRealtime(server: http.Server, deps: RealtimeDeps) {
  const adapterPool = createPgPool(deps.config.DATABASE_URL, 3, (error) =>
    deps.logger.warn({ err: error }, 'realtime adapter connection failed'),
  );
  const io: RealtimeServer = new Server(server, {
    serveClient: false,
    // Browsers send Origin: a page of another origin must not open a socket with our session cookie.
    allowRequest: (req, callback) =>
      callback(null, isOwnOrigin(req.headers.origin, req.headers.host, deps.config.PUBLIC_URL)),
    adapter: createAdapter(adapterPool, {
      errorHandler: (error: Error) => deps.logger.warn({ err: error }, 'realtime adapter error'),
    }),
  });
  authenticateSockets(io, deps);
  io.on('connection', (socket) => registerWatchHandlers(socket, deps.db));
  deps.publisher.attach(io);
  const revocations = listenForRevocations(io, adapterPool, deps.logger);
  return {
    io,
    async close(): Promise<void> {
      deps.publisher.attach(null);
      await revocations.stop();
      await io.close();
      await adapterPool.end();
    },
  };
}

export type Realtime = ReturnType<typeof createRealtime>;

/** True for requests without Origin (scripts) and for the api's own origin, as seen or as configured. */
function isOwnOrigin(origin: string | undefined, host: string | undefined, publicUrl: string): boolean {
  if (origin === undefined) return true;
  try {
    const { host: originHost, origin: normalised } = new URL(origin);
    return originHost === host || normalised === new URL(publicUrl).origin;
  } catch {
    return false;
  }
}
