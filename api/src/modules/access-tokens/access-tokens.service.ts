import { announceRevocation } from '../../realtime/access-revocation.js';
import type { SignedInUser } from '../../auth/user.js';
import type { Db } from '../../db/knex.js';
import { forbidden, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { findToken, insertToken, listTokens, revokeToken, toAccessToken } from './access-tokens.repository.js';
import { newTokenSecret } from './token-secret.js';

export async function listAccessTokens(db: Db, user: SignedInUser, all: boolean) {
  if (all && !user.roles.includes('admin'))
    throw forbidden("Listing every user's tokens needs the administrator role.");
  return (await listTokens(db, all ? null : user.id)).map((row) => toAccessToken(row, all));
}

/** Issues a token for a user; the plain secret leaves this function once and is never stored. */
export async function createAccessToken(db: Db, owner: { id: string; email: string }, label: string) {
  const secret = newTokenSecret();
  return db.transaction(async (trx) => {
    const row = await insertToken(trx, { userId: owner.id, label, prefix: secret.prefix, hash: secret.hash });
    await recordAudit(trx, {
      actor: owner,
      action: 'access_token.created',
      targetType: 'access_token',
      targetId: row.id,
      details: { label },
    });
    return { ...toAccessToken(row), token: secret.token };
  });
}

export async function revokeAccessToken(db: Db, user: SignedInUser, id: string) {
  const row = isUuid(id) ? await findToken(db, id) : undefined;
  if (!row) throw notFound(`Access token ${id}`);
  if (row.user_id !== user.id && !user.roles.includes('admin'))
    throw forbidden('Only the owner or an administrator can revoke this token.');
  await db.transaction(async (trx) => {
    await revokeToken(trx, id);
    await announceRevocation(trx, { tokenId: id });
    await recordAudit(trx, {
      actor: user,
      action: 'access_token.revoked',
      targetType: 'access_token',
      targetId: id,
      details: { label: row.label },
    });
  });
}
