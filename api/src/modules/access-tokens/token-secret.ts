import { createHash, randomBytes } from 'node:crypto';

const PREFIX = 'slt_';

/**
 * A new token secret: shown once; only its SHA-256 hash is stored. The prefix tells the kind
 * (slt_ a user's access token, sli_ an ingest source's token) to people and to the bearer check.
 */
export function newTokenSecret(prefix = PREFIX): { token: string; prefix: string; hash: string } {
  const token = prefix + randomBytes(32).toString('base64url');
  return { token, prefix: token.slice(0, prefix.length + 6), hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
