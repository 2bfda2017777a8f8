import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient, tokenRequest } from '../helpers/session-client.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

const stack = inject('stack');
let api: RunningApi;
let operator: SessionClient;
let admin: SessionClient;
const db = createPgPool(stack.databaseUrl, 2);

beforeAll(async () => {
  api = await startApi(stack);
  operator = new SessionClient(api.url);
  admin = new SessionClient(api.url);
  await operator.signIn('operator@quillmere.example');
  await admin.signIn('admin@quillmere.example');
});
afterAll(async () => {
  await api.close();
  await db.end();
});

describe('access tokens', () => {
  it('shows the secret once, stores only its SHA-256 hash and records its use', async () => {
    const created = await operator.request<{ id: string; token: string; prefix: string }>(
      'POST',
      '/api/v1/access-tokens',
      { label: 'trend export' },
      { csrf: true },
    );
    expect(created.status).toBe(201);
    expect(created.body.token.startsWith(created.body.prefix)).toBe(true);

    const stored = await db.query('SELECT * FROM access_tokens WHERE id = $1', [created.body.id]);
    expect(JSON.stringify(stored.rows[0])).not.toContain(created.body.token);
    expect(stored.rows[0].token_hash).toBe(createHash('sha256').update(created.body.token).digest('hex'));
    expect(stored.rows[0].last_used_at).toBeNull();

    const me = await tokenRequest<{ email: string }>(api.url, created.body.token, 'GET', '/api/v1/me');
    expect(me.body.email).toBe('operator@quillmere.example');
    const listed = await operator.request<{ id: string; lastUsedAt: string | null; token?: string }[]>(
      'GET',
      '/api/v1/access-tokens',
    );
    const mine = listed.body.find((t) => t.id === created.body.id);
    expect(mine?.lastUsedAt).not.toBeNull();
    expect(mine?.token).toBeUndefined();
  });

  it('acts with the owner roles only', async () => {
    const created = await operator.request<{ token: string }>(
      'POST',
      '/api/v1/access-tokens',
      { label: 'limited' },
      { csrf: true },
    );
    const users = await tokenRequest(api.url, created.body.token, 'GET', '/api/v1/users');
    expect(users.status).toBe(403);
  });

  it('stops working once revoked, and another user cannot revoke it', async () => {
    const created = await operator.request<{ id: string; token: string }>(
      'POST',
      '/api/v1/access-tokens',
      { label: 'to revoke' },
      { csrf: true },
    );
    const engineer = new SessionClient(api.url);
    await engineer.signIn('engineer@quillmere.example');
    expect(
      (await engineer.request('DELETE', `/api/v1/access-tokens/${created.body.id}`, undefined, { csrf: true })).status,
    ).toBe(403);
    expect(
      (await operator.request('DELETE', `/api/v1/access-tokens/${created.body.id}`, undefined, { csrf: true })).status,
    ).toBe(204);
    const after = await tokenRequest<{ error: { code: string } }>(api.url, created.body.token, 'GET', '/api/v1/me');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('invalid_token');
  });

  it('lets an admin list every user token', async () => {
    const all = await admin.request<{ userEmail: string }[]>('GET', '/api/v1/access-tokens?all=true');
    expect(all.status).toBe(200);
    expect(all.body.some((t) => t.userEmail === 'operator@quillmere.example')).toBe(true);
    expect((await operator.request('GET', '/api/v1/access-tokens?all=true')).status).toBe(403);
  });

  it('issues a working token from the admin command, printing only the token', () => {
    const out = execFileSync(
      'npm',
      ['run', '--silent', 'admin', '--', 'issue-token', '--email', 'engineer@quillmere.example', '--label', 'cli'],
      {
        env: { ...process.env, DATABASE_URL: stack.databaseUrl },
        encoding: 'utf8',
      },
    );
    expect(out).toMatch(/^slt_[\w-]{43}\n$/);
    return tokenRequest<{ email: string }>(api.url, out.trim(), 'GET', '/api/v1/me').then((me) =>
      expect(me.body.email).toBe('engineer@quillmere.example'),
    );
  });

  it('rejects a label that is empty, naming the field', async () => {
    const response = await operator.request<{ error: { code: string; message: string } }>(
      'POST',
      '/api/v1/access-tokens',
      { label: '' },
      { csrf: true },
    );
    expect(response.status).toBe(400);
    expect(response.body.error.message).toContain('body.label');
  });
});
