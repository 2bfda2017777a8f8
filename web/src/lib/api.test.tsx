import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { errorBody, jsonResponse, stubFetch } from '../test/fake-api';
import { ApiError, apiFetch, forgetCsrfToken } from './api';

function headerOf(init: RequestInit | undefined, name: string): string | undefined {
  return (init?.headers as Record<string, string> | undefined)?.[name];
}

describe('apiFetch', () => {
  beforeEach(() => forgetCsrfToken());
  afterEach(() => vi.unstubAllGlobals());

  it('sends the session cookie and returns the parsed body', async () => {
    const fetchMock = stubFetch({ 'GET /api/v1/me': { body: { name: 'Ada' } } });
    await expect(apiFetch('/api/v1/me')).resolves.toEqual({ name: 'Ada' });
    expect(fetchMock.mock.calls[0]?.[1]?.credentials).toBe('include');
  });

  it('turns the error shape into an ApiError with status, code, message and details', async () => {
    stubFetch({
      'PUT /api/v1/users/u1/roles': {
        status: 400,
        body: errorBody('validation_failed', 'Roles must be a list.', [{ path: ['roles'] }]),
      },
      'GET /api/v1/csrf-token': { body: { token: 't' } },
    });
    const failure = await apiFetch('/api/v1/users/u1/roles', { method: 'PUT', body: {} }).catch((e: unknown) => e);
    expect(failure).toBeInstanceOf(ApiError);
    expect(failure).toMatchObject({
      status: 400,
      code: 'validation_failed',
      message: 'Roles must be a list.',
      details: [{ path: ['roles'] }],
    });
  });

  it('explains an answer that is not in the error shape', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('<html>Bad gateway</html>', { status: 502 })),
    );
    await expect(apiFetch('/api/v1/me')).rejects.toMatchObject({ status: 502, code: 'http_error' });
  });

  it('reports a network failure as status 0', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    await expect(apiFetch('/api/v1/me')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });

  it('fetches the CSRF token once and sends it on every state-changing request', async () => {
    const fetchMock = stubFetch({
      'GET /api/v1/csrf-token': { body: { token: 'csrf-1' } },
      'DELETE /api/v1/access-tokens/a': { status: 204 },
      'DELETE /api/v1/access-tokens/b': { status: 204 },
    });
    await expect(apiFetch('/api/v1/access-tokens/a', { method: 'DELETE' })).resolves.toBeUndefined();
    await apiFetch('/api/v1/access-tokens/b', { method: 'DELETE' });
    const paths = fetchMock.mock.calls.map(([input]) => String(input));
    expect(paths).toEqual(['/api/v1/csrf-token', '/api/v1/access-tokens/a', '/api/v1/access-tokens/b']);
    expect(headerOf(fetchMock.mock.calls[2]?.[1], 'x-csrf-token')).toBe('csrf-1');
  });

  it('does not send a CSRF token on a GET', async () => {
    const fetchMock = stubFetch({ 'GET /api/v1/users': { body: [] } });
    await apiFetch('/api/v1/users');
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(headerOf(fetchMock.mock.calls[0]?.[1], 'x-csrf-token')).toBeUndefined();
  });

  it('fetches a fresh CSRF token once when the server says the old one is invalid', async () => {
    let tokenCalls = 0;
    const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      if (String(input) === '/api/v1/csrf-token') return jsonResponse({ body: { token: `t${++tokenCalls}` } });
      if (headerOf(init, 'x-csrf-token') === 't1') {
        return jsonResponse({ status: 403, body: errorBody('csrf_invalid', 'The form token has expired.') });
      }
      return jsonResponse({ status: 201, body: { id: 'k1' } });
    });
    vi.stubGlobal('fetch', fetchMock);
    await expect(apiFetch('/api/v1/access-tokens', { method: 'POST', body: { label: 'x' } })).resolves.toEqual({
      id: 'k1',
    });
    expect(tokenCalls).toBe(2);
    expect(fetchMock).toHaveBeenCalledTimes(4);
  });

  it('gives up after one fresh CSRF token', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL) =>
        String(input) === '/api/v1/csrf-token'
          ? jsonResponse({ body: { token: 'stale' } })
          : jsonResponse({ status: 403, body: errorBody('csrf_invalid', 'The form token has expired.') }),
      ),
    );
    await expect(apiFetch('/auth/logout', { method: 'POST' })).rejects.toMatchObject({
      status: 403,
      code: 'csrf_invalid',
    });
  });
});
