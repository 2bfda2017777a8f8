import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { DEMO_ACCOUNTS } from '../../ops/idp/demo-accounts.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient } from '../helpers/session-client.js';
import { NEWCOMER } from '../helpers/test-env.js';

const stack = inject('stack');
let api: RunningApi;
beforeAll(async () => {
  api = await startApi(stack);
});
afterAll(async () => {
  await api.close();
});

describe('sign-in through the identity provider (browserless)', () => {
  it.each(DEMO_ACCOUNTS)('$email signs in and /api/v1/me shows the demo roles', async (account) => {
    const client = new SessionClient(api.url);
    const { landedAt, finalStatus } = await client.signIn(account.email);
    expect(finalStatus).toBe(302);
    expect(landedAt).toBe(`${api.url}/`);
    const me = await client.request<{ email: string; name: string; roles: string[] }>('GET', '/api/v1/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: account.email, name: account.name });
    expect(me.body.roles.sort()).toEqual([...account.roles].sort());
  });

  it('refuses a wrong password and leaves the browser signed out', async () => {
    const client = new SessionClient(api.url);
    const { finalStatus, landedAt, page } = await client.signIn('operator@quillmere.example', 'not-the-password');
    expect(finalStatus).toBe(401);
    expect(landedAt).toContain(stack.idpIssuer);
    expect(page).toContain('do not match');
    expect((await client.request('GET', '/api/v1/me')).status).toBe(401);
  });

  it('provisions a first-time user with the roles of the groups claim', async () => {
    const client = new SessionClient(api.url);
    await client.signIn(NEWCOMER.email);
    const me = await client.request<{ roles: string[] }>('GET', '/api/v1/me');
    expect(me.status).toBe(200);
    expect(me.body.roles).toEqual(['operator']);
  });

  it('GET /auth/login redirects to the provider', async () => {
    const response = await fetch(`${api.url}/auth/login`, { redirect: 'manual' });
    expect(response.status).toBe(302);
    expect(response.headers.get('location')).toMatch(new RegExp(`^${stack.idpIssuer}/auth\\?`));
  });

  it('sets an httpOnly SameSite=Lax session cookie', async () => {
    const client = new SessionClient(api.url);
    await client.signIn('operator@quillmere.example');
    const cookies = await client.jar.getCookies(api.url);
    const session = cookies.find((c) => c.key === 'shadowloop.sid');
    expect(session?.httpOnly).toBe(true);
    expect(session?.sameSite).toBe('lax');
  });

  it('sign-out ends the session', async () => {
    const client = new SessionClient(api.url);
    await client.signIn('oncall@quillmere.example');
    expect((await client.request('GET', '/api/v1/me')).status).toBe(200);
    expect((await client.request('POST', '/auth/logout', undefined, { csrf: true })).status).toBe(204);
    expect((await client.request('GET', '/api/v1/me')).status).toBe(401);
  });
});
