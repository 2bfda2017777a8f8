import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient, tokenRequest } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;
beforeAll(async () => {
  api = await startApi(stack);
  engineer = new SessionClient(api.url);
  await engineer.signIn('engineer@quillmere.example');
});
afterAll(async () => {
  await api.close();
});

describe('CSRF protection of cookie-authenticated changes', () => {
  it('rejects a state-changing request without the token', async () => {
    const response = await engineer.request<{ error: { code: string } }>('POST', '/api/v1/access-tokens', {
      label: 'no csrf',
    });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('csrf_invalid');
  });

  it('rejects a forged token', async () => {
    const response = await engineer.raw(`${api.url}/api/v1/access-tokens`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-csrf-token': 'forged' },
      body: JSON.stringify({ label: 'forged' }),
    });
    expect(response.status).toBe(403);
  });

  it('accepts the session token from GET /api/v1/csrf-token', async () => {
    const response = await engineer.request('POST', '/api/v1/access-tokens', { label: 'with csrf' }, { csrf: true });
    expect(response.status).toBe(201);
  });

  it('does not ask bearer-token scripts for a CSRF token', async () => {
    const created = await engineer.request<{ token: string }>(
      'POST',
      '/api/v1/access-tokens',
      { label: 'script' },
      { csrf: true },
    );
    const response = await tokenRequest(api.url, created.body.token, 'POST', '/api/v1/access-tokens', {
      label: 'made by a script',
    });
    expect(response.status).toBe(201);
  });
});
