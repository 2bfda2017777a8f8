import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Db } from '../../db/knex.js';
import { signAckToken } from './ack-token.js';

export interface AckLinkRow {
  id: string;
  alert_id: string;
  user_id: string | null;
  expires_at: Date;
  used_at: Date | null;
}

/**
 * One link for one addressee, valid for alert_settings.ack_link_ttl_min from now (the database's
 * clock, which also judges expiry). Expiry is kept to whole milliseconds so that the token's copy
 * matches the row exactly.
 */
export async function createAckLink(
  trx: Knex.Transaction,
  key: Buffer,
  alertId: string,
  userId: string,
): Promise<{ token: string; expiresAt: Date }> {
  const id = randomUUID();
  const [row] = (await trx('alert_ack_links')
    .insert({
      id,
      alert_id: alertId,
      user_id: userId,
      expires_at: trx.raw(
        `date_trunc('milliseconds', now() + make_interval(mins => (SELECT ack_link_ttl_min FROM alert_settings WHERE id = 1)))`,
      ),
    })
    .returning(['expires_at'])) as { expires_at: Date }[];
  return { token: signAckToken(key, id, row.expires_at), expiresAt: row.expires_at };
}

/**
 * The link rows (one per addressee, ids drawn here) and their signed tokens, by user id, for an
 * insert the caller makes: expiresAt is the row's expiry as {@link createAckLink} computes it (the
 * caller reads it on the database clock, in whole milliseconds).
 */
export function ackLinkRows(
  key: Buffer,
  alertId: string,
  userIds: string[],
  expiresAt: Date,
): Map<string, { row: { id: string; alert_id: string; user_id: string; expires_at: Date }; token: string }> {
  return new Map(
    userIds.map((userId) => {
      const id = randomUUID();
      const row = { id, alert_id: alertId, user_id: userId, expires_at: expiresAt };
      return [userId, { row, token: signAckToken(key, id, expiresAt) }];
    }),
  );
}

export async function findAckLink(db: Db, id: string): Promise<AckLinkRow | undefined> {
  return (await db('alert_ack_links').where({ id }).first('id', 'alert_id', 'user_id', 'expires_at', 'used_at')) as
    AckLinkRow | undefined;
}

/**
 * Marks the link used by actor if it is still unused and unexpired (by its row and by notAfter,
 * the token's signed expiry); false otherwise. One statement, so of two clicks at once one wins.
 */
export async function useAckLink(trx: Knex.Transaction, id: string, actorId: string, notAfter: Date): Promise<boolean> {
  const rows = await trx('alert_ack_links')
    .where({ id })
    .whereNull('used_at')
    .andWhere('expires_at', '>', trx.fn.now())
    .andWhereRaw('?::timestamptz > now()', [notAfter])
    .update({ used_at: trx.fn.now(), used_by: actorId })
    .returning('id');
  return rows.length === 1;
}
