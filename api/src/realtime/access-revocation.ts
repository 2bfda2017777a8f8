import type { Knex } from 'knex';
import type pg from 'pg';
import type { Logger } from 'pino';
import type { Db } from '../db/knex.js';
import { listenOnChannel } from '../lib/pg-listen.js';
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

/** Disconnects this process's sockets in the room a revocation notice names. */
export function listenForRevocations(io: RealtimeServer, pool: pg.Pool, logger: Logger): { stop(): Promise<void> } {
  return listenOnChannel(
    pool,
    ACCESS_CHANNEL,
    (payload) => {
      const room = roomOf(payload);
      if (room) io.local.in(room).disconnectSockets(true);
    },
    logger,
  );
}
