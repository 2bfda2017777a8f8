import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let admin: SessionClient;
type User = { id: string; email: string; roles: string[] };
type Audit = { items: { action: string; actorEmail: string; details: { before: string[]; after: string[] } }[] };

beforeAll(async () => {
  api = await startApi(stack);
  admin = new SessionClient(api.url);
  await admin.signIn('admin@quillmere.example');
});
afterAll(async () => {
  await api.close();
});

const userByEmail = async (email: string) =>
  (await admin.request<User[]>('GET', '/api/v1/users')).body.find((u) => u.email === email) as User;

describe('users and roles (admin)', () => {
  it('lists users with their roles', async () => {
    const reviewer = await userByEmail('reviewer@quillmere.example');
    expect(reviewer.roles).toEqual(['engineer']);
  });

  it('changes roles, takes effect on the next request, and audits who changed what', async () => {
    const operatorUser = await userByEmail('operator@quillmere.example');
    const operator = new SessionClient(api.url);
    await operator.signIn('operator@quillmere.example');
    expect((await operator.request('GET', '/api/v1/audit')).status).toBe(403);

    const changed = await admin.request<User>(
      'PUT',
      `/api/v1/users/${operatorUser.id}/roles`,
      { roles: ['operator', 'oncall'] },
      { csrf: true },
    );
    expect(changed.status).toBe(200);
    expect(changed.body.roles).toEqual(['oncall', 'operator']);
    expect((await operator.request<{ roles: string[] }>('GET', '/api/v1/me')).body.roles).toEqual([
      'oncall',
      'operator',
    ]);

    const audit = await admin.request<Audit>('GET', '/api/v1/audit?action=user.roles_changed');
    expect(audit.body.items[0]).toMatchObject({
      actorEmail: 'admin@quillmere.example',
      details: { before: ['operator'], after: ['oncall', 'operator'] },
    });
    await admin.request('PUT', `/api/v1/users/${operatorUser.id}/roles`, { roles: ['operator'] }, { csrf: true });
  });

  it('refuses an unknown role with the field named', async () => {
    const user = await userByEmail('oncall@quillmere.example');
    const response = await admin.request<{ error: { message: string } }>(
      'PUT',
      `/api/v1/users/${user.id}/roles`,
      { roles: ['superuser'] },
      { csrf: true },
    );
    expect(response.status).toBe(400);
    expect(response.body.error.message).toContain('body.roles.0');
  });

  it('refuses to let an admin remove their own admin role', async () => {
    const self = await userByEmail('admin@quillmere.example');
    const response = await admin.request<{ error: { code: string } }>(
      'PUT',
      `/api/v1/users/${self.id}/roles`,
      { roles: ['operator'] },
      { csrf: true },
    );
    expect(response.status).toBe(422);
    expect((await userByEmail('admin@quillmere.example')).roles).toContain('admin');
  });

  it('answers 404 for a user that does not exist', async () => {
    const response = await admin.request(
      'PUT',
      '/api/v1/users/00000000-0000-4000-8000-000000000000/roles',
      { roles: [] },
      { csrf: true },
    );
    expect(response.status).toBe(404);
  });
});
