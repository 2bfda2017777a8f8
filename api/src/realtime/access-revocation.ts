import type { Knex } from 'knex';
import type pg from 'pg';
import type { Logger } from 'pino';
import type { Db } from '../db/knex.js';
import type { RealtimeServer } from './realtime-types.js';

/**
 * Open sockets follow the access behind them: when a person signs out, an access token is revoked
 * or a person's roles change, every api process closes the sockets opened with that session, that
 * token or by that person (a browser reconnects and is checked afresh). The change sends a
 * PostgreSQL NOTIFY inside its own transaction, so it is delivered only if the change commits.
 */
export const ACCESS_CHANNEL = 'shadowloop_access_revoked';

export type AccessRevocation = { sessionId: string } | { tokenId: string } | { userId: string };

export const sessionRoom = (sessionId: string) => `session:${sessionId}`;
export const tokenRoom = (tokenId: string) => `token:${tokenId}`;
export const userRoom = (userId: string) => `user:${userId}`;

/** Queues the revocation notice in the caller's transaction (or at once outside one). */
export async function announceRevocation(db: Db | Knex.Transaction, revocation: AccessRevocation): Promise<void> {
  await db.raw('SELECT pg_notify(?, ?)', [ACCESS_CHANNEL, JSON.stringify(revocation)]);
}

function roomOf(payload: string): string | null {
  try {
    const notice = JSON.parse(payload) as Partial<Record<'sessionId' | 'tokenId' | 'userId', unknown>>;
    if (typeof notice.sessionId === 'string') return sessionRoom(notice.sessionId);
    if (typeof notice.tokenId === 'string') return tokenRoom(notice.tokenId);
    if (typeof notice.userId === 'string') return userRoom(notice.userId);
  } catch {
    // not ours
  }
  return null;
}

/**
 * LISTENs on one connection of the pool and disconnects this process's sockets in the room the
 * notice names. Reconnects after a lost connection. stop() releases the connection.
 */
export function listenForRevocations(io: RealtimeServer, pool: pg.Pool, logger: Logger): { stop(): Promise<void> } {
  let client: pg.PoolClient | null = null;
  let stopped = false;
  let retry: NodeJS.Timeout | null = null;
  const connect = async () => {
    try {
      const connection = await pool.connect();
      if (stopped) return connection.release();
      client = connection;
      connection.on('notification', (message) => {
        if (message.channel !== ACCESS_CHANNEL || !message.payload) return;
        const room = roomOf(message.payload);
        if (room) io.local.in(room).disconnectSockets(true);
      });
      connection.on('error', (error) => {
        logger.warn({ err: error }, 'access revocation listener lost its connection; reconnecting');
        connection.release(error);
        client = null;
        if (!stopped) retry = setTimeout(() => void connect(), 1000);
      });
      await connection.query(`LISTEN ${ACCESS_CHANNEL}`);
    } catch (error) {
      logger.warn({ err: error }, 'access revocation listener cannot connect; retrying');
      if (!stopped) retry = setTimeout(() => void connect(), 1000);
    }
  };
  void connect();
  return {
    async stop() {
      stopped = true;
      if (retry) clearTimeout(retry);
      const held = client;
      client = null;
      if (held) {
        await held.query(`UNLISTEN ${ACCESS_CHANNEL}`).catch(() => undefined);
        held.release();
      }
    },
  };
}
