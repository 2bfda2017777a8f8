import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * Signed one-click acknowledge tokens: base64url(payload).base64url(HMAC-SHA256(key, payload)),
 * payload "<alert_ack_links.id>:<expiry in ms since the epoch>". The signature proves the link
 * came from us; the alert_ack_links row makes it work once.
 */

/** A key of its own for the links, derived from the session secret (never the secret itself). */
export function ackLinkKey(sessionSecret: string): Buffer {
  return createHmac('sha256', sessionSecret).update('shadowloop alert acknowledge link v1').digest();
}

const sign = (key: Buffer, payload: string) => createHmac('sha256', key).update(payload).digest();
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
const BASE64URL = /^[A-Za-z0-9_-]+$/;

export function signAckToken(key: Buffer, linkId: string, expiresAt: Date): string {
  const payload = `${linkId}:${expiresAt.getTime()}`;
  return `${Buffer.from(payload).toString('base64url')}.${sign(key, payload).toString('base64url')}`;
}

/** The link id and expiry of a genuine token; null for anything malformed or not signed with key. */
export function readAckToken(key: Buffer, token: string): { linkId: string; expiresAt: Date } | null {
  const parts = token.split('.');
  if (parts.length !== 2 || !parts.every((p) => BASE64URL.test(p))) return null;
  const payload = Buffer.from(parts[0], 'base64url').toString();
  // Compared as text: base64url leaves spare bits in its last character, so decoding would
  // accept more than one spelling of the same signature.
  const given = Buffer.from(parts[1]);
  const expected = Buffer.from(sign(key, payload).toString('base64url'));
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  if (Buffer.from(payload).toString('base64url') !== parts[0]) return null;
  const match = /^([0-9a-f-]{36}):(\d{1,15})$/.exec(payload);
  if (!match || !UUID.test(match[1])) return null;
  return { linkId: match[1], expiresAt: new Date(Number(match[2])) };
}
