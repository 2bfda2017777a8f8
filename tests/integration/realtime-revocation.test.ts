import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { OPERATOR, signedIn } from '../helpers/registry-fixtures.js';
import { SessionClient } from '../helpers/session-client.js';
import { personalToken } from '../helpers/twin-fixtures.js';
import { connected, twinSocket, type TwinSocket } from '../helpers/twin-socket.js';

/**
 * Open sockets follow the access behind them, on every api process: a revoked token, a signed-out
 * session and a change of roles close the sockets opened with them (the browser reconnects and is
 * checked afresh). Two api processes share the database; the change is made on the first, the
 * socket is held by the second.
 */
const stack = inject('stack');
let api: RunningApi;
let second: RunningApi;
const sockets: TwinSocket[] = [];

beforeAll(async () => {
  api = await startApi(stack, { ALERT_WORKERS: 'false' });
  second = await startApi(stack, { ALERT_WORKERS: 'false' });
});
afterEach(() => {
  for (const socket of sockets.splice(0)) socket.disconnect();
});
afterAll(async () => {
  await second.close();
  await api.close();
});

function open(credentials: { token?: string; cookie?: string }): TwinSocket {
  const socket = twinSocket(second.url, credentials);
  sockets.push(socket);
  return socket;
}

/** Resolves with the disconnect reason, or "still connected" after the time runs out. */
function disconnection(socket: TwinSocket, timeoutMs = 5000): Promise<string> {
  return new Promise((resolve) => {
    const timer = setTimeout(() => resolve('still connected'), timeoutMs);
    socket.once('disconnect', (reason) => {
      clearTimeout(timer);
      resolve(reason);
    });
  });
}

describe('open sockets follow revocations', () => {
  it('closes a socket opened with an access token when the token is revoked, and refuses it afterwards', async () => {
    const operator = await signedIn(api.url, OPERATOR);
    const token = await personalToken(operator, 'revocation test');
    const other = await personalToken(operator, 'revocation test, kept');
    const revoked = open({ token });
    const kept = open({ token: other });
    await Promise.all([connected(revoked), connected(kept)]);
    const tokens = await operator.request<{ id: string; label: string; revokedAt: string | null }[]>(
      'GET',
      '/api/v1/access-tokens',
    );
    const id = tokens.body.find((t) => t.label === 'revocation test' && !t.revokedAt)?.id;
    expect(id).toBeDefined();
    const closed = disconnection(revoked);
    const stillOpen = disconnection(kept, 1500);
    expect((await operator.request('DELETE', `/api/v1/access-tokens/${id}`, undefined, { csrf: true })).status).toBe(
      204,
    );
    expect(await closed).toBe('io server disconnect');
    expect(await stillOpen).toBe('still connected');
    await expect(connected(open({ token }))).rejects.toThrow();
  });

  it('closes the sockets of a browser session when it signs out, not those of another session', async () => {
    // sessions of their own: signedIn() shares one cached session per account with other suites
    const leaving = new SessionClient(api.url);
    const staying = new SessionClient(api.url);
    await leaving.signIn(OPERATOR);
    await staying.signIn(OPERATOR);
    const socket = open({ cookie: await leaving.jar.getCookieString(second.url) });
    const otherSession = open({ cookie: await staying.jar.getCookieString(second.url) });
    await Promise.all([connected(socket), connected(otherSession)]);
    const closed = disconnection(socket);
    const stillOpen = disconnection(otherSession, 1500);
    expect((await leaving.request('POST', '/auth/logout', undefined, { csrf: true })).status).toBe(204);
    expect(await closed).toBe('io server disconnect');
    expect(await stillOpen).toBe('still connected');
  });

  it("closes a person's sockets when an administrator sets their roles", async () => {
    const admin = await signedIn(api.url, 'admin@quillmere.example');
    const operator = await signedIn(api.url, OPERATOR);
    const me = await operator.request<{ id: string; roles: string[] }>('GET', '/api/v1/me');
    const socket = open({ cookie: await operator.jar.getCookieString(second.url) });
    await connected(socket);
    const closed = disconnection(socket);
    const users = await admin.request<{ id: string; email: string; roles: string[] }[]>('GET', '/api/v1/users');
    const target = users.body.find((u) => u.email === OPERATOR);
    expect(target).toBeDefined();
    // the same roles again: nothing changes for other suites, and the sockets are still re-checked
    const changed = await admin.request(
      'PUT',
      `/api/v1/users/${target?.id}/roles`,
      { roles: target?.roles },
      { csrf: true },
    );
    expect(changed.status).toBe(200);
    expect(await closed).toBe('io server disconnect');
    expect(me.body.roles).toEqual(target?.roles);
  });
});
