import { createHash, randomBytes } from 'node:crypto';

const PREFIX = 'slt_';

/** A new access token: shown once; only its SHA-256 hash is stored. */
export function newTokenSecret(): { token: string; prefix: string; hash: string } {
  const token = PREFIX + randomBytes(32).toString('base64url');
  return { token, prefix: token.slice(0, PREFIX.length + 6), hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}
