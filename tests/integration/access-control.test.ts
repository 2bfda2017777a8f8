import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient } from '../helpers/session-client.js';

/**
 * Every declared route × every role: 401 without sign-in, 403 without the route's role, and
 * neither 401 nor 403 with it. The route list comes from the OpenAPI document, so a new route
 * joins this table by being declared.
 */
const stack = inject('stack');
let api: RunningApi;
const clients: Record<string, SessionClient> = {};
const ACCOUNTS = {
  operator: 'operator@quillmere.example',
  engineer: 'engineer@quillmere.example',
  oncall: 'oncall@quillmere.example',
  admin: 'admin@quillmere.example',
};
const HELD: Record<string, string[]> = {
  operator: ['operator'],
  engineer: ['engineer'],
  oncall: ['oncall'],
  admin: ['operator', 'engineer', 'oncall', 'admin'],
};

type Operation = { 'x-roles': 'public' | 'signed-in' | string[] };
let routes: { method: string; path: string; access: Operation['x-roles'] }[] = [];

beforeAll(async () => {
  api = await startApi(stack);
  for (const [role, email] of Object.entries(ACCOUNTS)) {
    clients[role] = new SessionClient(api.url);
    await clients[role].signIn(email);
  }
  const doc = (await (await fetch(`${api.url}/api/v1/openapi.json`)).json()) as {
    paths: Record<string, Record<string, Operation>>;
  };
  routes = Object.entries(doc.paths).flatMap(([path, ops]) =>
    Object.entries(ops).map(([method, op]) => ({
      method: method.toUpperCase(),
      path: path.replace(/\{[^}]+\}/g, '00000000-0000-4000-8000-000000000000'),
      access: op['x-roles'],
    })),
  );
});
afterAll(async () => {
  await api.close();
});

const unsafe = (method: string) => method !== 'GET';

describe('route × role table', () => {
  it('covers the routes of the foundation', () => {
    const paths = routes.map((r) => `${r.method} ${r.path}`);
    expect(paths).toEqual(
      expect.arrayContaining([
        'GET /api/v1/me',
        'GET /api/v1/users',
        'GET /api/v1/audit',
        'GET /api/v1/dev/mail',
        'POST /api/v1/access-tokens',
      ]),
    );
    expect(routes.length).toBeGreaterThanOrEqual(10);
  });

  it('answers 401 JSON to every protected route without sign-in', async () => {
    const anonymous = new SessionClient(api.url);
    for (const route of routes.filter((r) => r.access !== 'public')) {
      const response = await anonymous.request<{ error: { code: string } }>(
        route.method,
        route.path,
        unsafe(route.method) ? {} : undefined,
      );
      expect(response.status, `${route.method} ${route.path}`).toBe(401);
      expect(response.body.error.code).toBe('unauthenticated');
    }
  });

  it.each(Object.keys(ACCOUNTS))('gives %s exactly the routes its roles allow', async (role) => {
    for (const route of routes.filter((r) => r.access !== 'public')) {
      const allowed = route.access === 'signed-in' || (route.access as string[]).some((r) => HELD[role].includes(r));
      const response = await clients[role].request<{ error?: { code: string } }>(
        route.method,
        route.path,
        unsafe(route.method) ? {} : undefined,
        { csrf: unsafe(route.method) },
      );
      const label = `${role} ${route.method} ${route.path} → ${response.status}`;
      if (allowed) expect([401, 403], label).not.toContain(response.status);
      else {
        expect(response.status, label).toBe(403);
        expect(response.body.error?.code, label).toBe('forbidden');
      }
    }
  });

  it('answers unknown API paths with 404 in the error shape', async () => {
    const response = await clients.operator.request<{ error: { code: string } }>('GET', '/api/v1/no-such-thing');
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('not_found');
  });
});
