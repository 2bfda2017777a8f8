import { vi } from 'vitest';

export type FakeReply = { status?: number; body?: unknown };
export type FakeHandler = (request: { url: string; init: RequestInit }) => FakeReply;
export type FakeRoutes = Record<string, FakeReply | FakeHandler>;

/** The id /api/v1/me answers for the signed-in test user (an author in fixtures that need one). */
export const SIGNED_IN_USER_ID = '11111111-1111-4111-8111-0000000000e1';

export function jsonResponse({ status = 200, body }: FakeReply): Response {
  if (status === 204 || body === undefined) return new Response(null, { status });
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json' },
  });
}

export function errorBody(code: string, message: string, details?: unknown) {
  return { error: { code, message, details } };
}

/**
 * Replaces the global fetch with a table of "METHOD /path" answers (the query string is part
 * of the path when the key contains "?"). Unlisted requests answer 404 in the API's error shape.
 */
export function stubFetch(routes: FakeRoutes) {
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const { pathname, search } = new URL(url, 'http://shadowloop.test');
    const method = (init.method ?? 'GET').toUpperCase();
    const entry = routes[`${method} ${pathname}${search}`] ?? routes[`${method} ${pathname}`];
    if (!entry) return jsonResponse({ status: 404, body: errorBody('not_found', `No route ${method} ${pathname}`) });
    return jsonResponse(typeof entry === 'function' ? entry({ url, init }) : entry);
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

export const HEALTHY = {
  status: 'ok',
  checks: {
    database: { ok: true },
    mail: { ok: true },
    identityProvider: { ok: true },
    simulator: { ok: true, lastBeatAt: null },
  },
};

export const NOBODY_ON_CALL = { at: '2025-03-01T08:00:00Z', primary: null, secondary: null, areas: [] };

/** The signed-in user and what the frame asks for on every page (nobody on call, no alerts waiting). */
export function signedInAs(roles: string[], name = 'Test Person') {
  return {
    'GET /api/v1/me': { body: { id: SIGNED_IN_USER_ID, email: 'person@quillmere.example', name, roles } },
    'GET /api/health': { body: HEALTHY },
    'GET /api/v1/csrf-token': { body: { token: 'csrf-1' } },
    'GET /api/v1/oncall/now': { body: NOBODY_ON_CALL },
    'GET /api/v1/alerts': { body: [] },
  } satisfies FakeRoutes;
}

/** The JSON body a fake route received. */
export function bodyOf(init: RequestInit): unknown {
  return JSON.parse(String(init.body));
}

/** The query of every request to a path, in order. */
export function queriesTo(fetchMock: { mock: { calls: unknown[][] } }, method: string, pathname: string) {
  return fetchMock.mock.calls
    .filter(([input, init]) => {
      const url = new URL(String(input), 'http://shadowloop.test');
      return url.pathname === pathname && ((init as RequestInit | undefined)?.method ?? 'GET') === method;
    })
    .map(([input]) => new URL(String(input), 'http://shadowloop.test').searchParams);
}
