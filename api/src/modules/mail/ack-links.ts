import type { SignedInUser } from '../../auth/user.js';
import type { Alert } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { AppError } from '../../http/errors.js';
import { acknowledgeAlert } from '../alerts/alerts.service.js';
import { findAckLink, useAckLink } from './ack-link-store.js';
import { readAckToken } from './ack-token.js';

export { createAckLink } from './ack-link-store.js';
export { ackLinkKey, readAckToken, signAckToken } from './ack-token.js';

/** What a token is worth: `valid` ones may still fail to acknowledge (role, alert state). */
export type AckTokenCheck =
  | { status: 'valid'; linkId: string; alertId: string; addresseeId: string | null; expiresAt: Date }
  | { status: 'used' | 'expired'; linkId: string; alertId: string }
  | { status: 'invalid' };

export type AckLinkOutcome =
  | { outcome: 'done'; alertId: string; alert: Alert }
  | { outcome: 'used' | 'expired' | 'already'; alertId: string }
  | { outcome: 'invalid' };

/**
 * Refuses a bad signature, an unknown link, a used one and an expired one (in that order). A link
 * expires at the earlier of its signed expiry and its row's.
 */
export async function verifyAckToken(db: Db, key: Buffer, token: string, now = new Date()): Promise<AckTokenCheck> {
  const claimed = readAckToken(key, token);
  if (!claimed) return { status: 'invalid' };
  const row = await findAckLink(db, claimed.linkId);
  if (!row) return { status: 'invalid' };
  if (row.used_at) return { status: 'used', linkId: row.id, alertId: row.alert_id };
  const expiresMs = Math.min(row.expires_at.getTime(), claimed.expiresAt.getTime());
  if (expiresMs <= now.getTime()) return { status: 'expired', linkId: row.id, alertId: row.alert_id };
  return {
    status: 'valid',
    linkId: row.id,
    alertId: row.alert_id,
    addresseeId: row.user_id,
    expiresAt: new Date(expiresMs),
  };
}

/** Thrown inside the transaction to undo the link's use when the alert cannot be acknowledged. */
class NotAcknowledgeable extends Error {}

/**
 * Uses the link and acknowledges its alert in one transaction: the link counts as used only if the
 * acknowledgement committed, and two clicks at once acknowledge once (the conditional UPDATE lets
 * one through; the other sees `used`). acknowledgeAlert runs on the transaction (its own
 * transaction, if it opens one, becomes a savepoint). An alert someone already acknowledged,
 * shelved or closed answers `already` and leaves the link unused. The caller publishes.
 */
export async function consumeAckLink(db: Db, key: Buffer, token: string, actor: SignedInUser): Promise<AckLinkOutcome> {
  const check = await verifyAckToken(db, key, token);
  if (check.status === 'invalid') return { outcome: 'invalid' };
  if (check.status !== 'valid') return { outcome: check.status, alertId: check.alertId };
  try {
    return await db.transaction(async (trx): Promise<AckLinkOutcome> => {
      if (!(await useAckLink(trx, check.linkId, actor.id, check.expiresAt))) {
        const again = await verifyAckToken(trx, key, token);
        return again.status === 'used' || again.status === 'expired'
          ? { outcome: again.status, alertId: again.alertId }
          : { outcome: 'invalid' };
      }
      const alert = await acknowledgeAlert(trx, actor, check.alertId, '', 'mail_link').catch((error: unknown) => {
        if (error instanceof AppError && error.status === 409) throw new NotAcknowledgeable();
        throw error;
      });
      return { outcome: 'done', alertId: check.alertId, alert };
    });
  } catch (error) {
    if (error instanceof NotAcknowledgeable) return { outcome: 'already', alertId: check.alertId };
    throw error;
  }
}
