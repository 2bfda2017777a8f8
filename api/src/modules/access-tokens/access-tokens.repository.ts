import type { Db } from '../../db/knex.js';
import { hashToken } from './token-secret.js';

type Raw = {
  id: string;
  label: string;
  prefix: string;
  created_at: Date;
  last_used_at: Date | null;
  revoked_at: Date | null;
  user_id: string;
  user_email?: string;
};

const iso = (d: Date | null) => (d ? d.toISOString() : null);
export const toAccessToken = (r: Raw, withUser = false) => ({
  id: r.id,
  label: r.label,
  prefix: r.prefix,
  createdAt: r.created_at.toISOString(),
  lastUsedAt: iso(r.last_used_at),
  revokedAt: iso(r.revoked_at),
  ...(withUser ? { userEmail: r.user_email } : {}),
});

export async function insertToken(db: Db, row: { userId: string; label: string; prefix: string; hash: string }) {
  const [inserted] = await db('access_tokens')
    .insert({ user_id: row.userId, label: row.label, prefix: row.prefix, token_hash: row.hash })
    .returning<Raw[]>('*');
  return inserted;
}

export async function listTokens(db: Db, userId: string | null) {
  const q = db('access_tokens as t')
    .join('users as u', 'u.id', 't.user_id')
    .select('t.*', 'u.email as user_email')
    .orderBy('t.created_at', 'desc');
  if (userId) q.where('t.user_id', userId);
  return (await q) as Raw[];
}

export async function findToken(db: Db, id: string) {
  return (await db('access_tokens').where({ id }).first()) as Raw | undefined;
}

export async function revokeToken(db: Db, id: string) {
  await db('access_tokens').where({ id }).whereNull('revoked_at').update({ revoked_at: db.fn.now() });
}

/** Resolves a presented token to its owner and records its use; undefined when unknown or revoked. */
export async function useToken(db: Db, token: string): Promise<{ userId: string; tokenId: string } | undefined> {
  const [row] = await db('access_tokens')
    .where({ token_hash: hashToken(token) })
    .whereNull('revoked_at')
    .update({ last_used_at: db.fn.now() })
    .returning<{ user_id: string; id: string }[]>(['user_id', 'id']);
  return row && { userId: row.user_id, tokenId: row.id };
}
