import { createHmac } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { ackLinkKey, readAckToken, signAckToken } from '../ack-token.js';

const key = ackLinkKey('unit-test-session-secret-0123456789abcdef');
const linkId = '6f1c2a4e-8b3d-4c5e-9f70-1a2b3c4d5e6f';
const expiresAt = new Date('2026-12-02T10:15:00.123Z');
const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_';
const flip = (text: string, at: number) => {
  const next = alphabet[(alphabet.indexOf(text[at]) + 1) % alphabet.length];
  return `${text.slice(0, at)}${next}${text.slice(at + 1)}`;
};

describe('one-click acknowledge tokens', () => {
  it('reads back the link id and expiry it was signed with', () => {
    const token = signAckToken(key, linkId, expiresAt);
    expect(token).toMatch(/^[A-Za-z0-9_-]+\.[A-Za-z0-9_-]{43}$/);
    expect(readAckToken(key, token)).toEqual({ linkId, expiresAt });
  });

  it('signs with HMAC-SHA256 over the payload (RFC 2104 construction via node:crypto)', () => {
    const [payload, signature] = signAckToken(key, linkId, expiresAt).split('.');
    expect(Buffer.from(payload, 'base64url').toString()).toBe(`${linkId}:${expiresAt.getTime()}`);
    const expected = createHmac('sha256', key).update(`${linkId}:${expiresAt.getTime()}`).digest('base64url');
    expect(signature).toBe(expected);
  });

  it('refuses every single-character change of the signature, the last character included', () => {
    const token = signAckToken(key, linkId, expiresAt);
    const dot = token.indexOf('.');
    for (let at = dot + 1; at < token.length; at++) expect(readAckToken(key, flip(token, at))).toBeNull();
  });

  it('refuses a changed payload (another link or a later expiry) under the old signature', () => {
    const [, signature] = signAckToken(key, linkId, expiresAt).split('.');
    const later = Buffer.from(`${linkId}:${expiresAt.getTime() + 86_400_000}`).toString('base64url');
    expect(readAckToken(key, `${later}.${signature}`)).toBeNull();
    const other = Buffer.from(`${linkId.replace('6f', '7f')}:${expiresAt.getTime()}`).toString('base64url');
    expect(readAckToken(key, `${other}.${signature}`)).toBeNull();
  });

  it('refuses a token signed with another secret', () => {
    const token = signAckToken(ackLinkKey('another-session-secret-0123456789abcdefgh'), linkId, expiresAt);
    expect(readAckToken(key, token)).toBeNull();
  });

  it('refuses malformed tokens without throwing', () => {
    for (const token of ['', '.', 'abc', 'a.b.c', 'a b.c', '%%.%%', `${'x'.repeat(10)}.`]) {
      expect(readAckToken(key, token)).toBeNull();
    }
  });

  it('refuses a well-signed payload that is not "<uuid>:<ms>"', () => {
    const payload = 'not-a-link:12';
    const signature = createHmac('sha256', key).update(payload).digest('base64url');
    expect(readAckToken(key, `${Buffer.from(payload).toString('base64url')}.${signature}`)).toBeNull();
  });

  it('derives the same 32-byte key from the same secret in every process, another from another', () => {
    const secret = 'unit-test-session-secret-0123456789abcdef';
    expect(ackLinkKey(secret).equals(key)).toBe(true);
    expect(ackLinkKey(`${secret}x`).equals(key)).toBe(false);
    expect(key).toHaveLength(32);
  });
});
