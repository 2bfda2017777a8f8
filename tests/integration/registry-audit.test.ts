import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { AuditEntry } from '../../api/src/contracts/users.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  act,
  approvedVersion,
  createDraft,
  createLoop,
  ENGINEER,
  OPERATOR,
  REVIEWER,
  signedIn,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;
let reviewer: SessionClient;

beforeAll(async () => {
  api = await startApi(stack);
  [engineer, reviewer] = await Promise.all([ENGINEER, REVIEWER].map((email) => signedIn(api.url, email)));
});
afterAll(async () => {
  await api.close();
});

type AuditPage = { items: AuditEntry[]; total: number };

describe('audit of the registry', () => {
  it("records every step with who, the loop's tag and the version number; a loop's log includes its versions", async () => {
    const loop = await createLoop(engineer);
    await engineer.request('PATCH', `/api/v1/loops/${loop.id}`, { name: 'Renamed loop' }, { csrf: true });
    const first = await approvedVersion(engineer, reviewer, loop.id);
    await act(reviewer, first.id, 'activate', { acknowledgeCautions: true });
    const second = await approvedVersion(engineer, reviewer, loop.id);
    await act(engineer, second.id, 'activate', { acknowledgeCautions: true });
    const rejected = await createDraft(engineer, loop.id);
    await act(engineer, rejected.id, 'submit');
    await act(reviewer, rejected.id, 'reject', { reason: 'Wrong gain' });
    await act(reviewer, second.id, 'retire', { note: 'Plant shut down' });

    const log = await engineer.request<AuditPage>('GET', `/api/v1/audit?targetType=loop&targetId=${loop.id}&limit=100`);
    expect(log.status).toBe(200);
    const steps = log.body.items
      .map((e) => [e.action, e.actorEmail, (e.details as { versionNumber?: number }).versionNumber ?? null])
      .reverse();
    expect(steps).toEqual([
      ['loop.created', ENGINEER, null],
      ['loop.updated', ENGINEER, null],
      ['model_version.created', ENGINEER, 1],
      ['model_version.submitted', ENGINEER, 1],
      ['model_version.approved', REVIEWER, 1],
      ['model_version.activated', REVIEWER, 1],
      ['model_version.created', ENGINEER, 2],
      ['model_version.submitted', ENGINEER, 2],
      ['model_version.approved', REVIEWER, 2],
      ['model_version.retired', ENGINEER, 1],
      ['model_version.activated', ENGINEER, 2],
      ['model_version.created', ENGINEER, 3],
      ['model_version.submitted', ENGINEER, 3],
      ['model_version.rejected', REVIEWER, 3],
      ['model_version.retired', REVIEWER, 2],
    ]);
    expect(log.body.items.every((e) => (e.details as { loopTag: string }).loopTag === loop.tag)).toBe(true);
    expect(log.body.items[0].details).toMatchObject({ previousStatus: 'active', note: 'Plant shut down' });
  });

  it('filters by target, and lets engineers and admins read the log but not operators', async () => {
    const loop = await createLoop(engineer);
    const draft = await createDraft(engineer, loop.id);
    const byVersion = await engineer.request<AuditPage>(
      'GET',
      `/api/v1/audit?targetType=model_version&targetId=${draft.id}`,
    );
    expect(byVersion.body.items.map((e) => e.action)).toEqual(['model_version.created']);
    expect(byVersion.body.items[0].target).toBe(`model_version:${draft.id}`);
    const operator = await signedIn(api.url, OPERATOR);
    expect((await operator.request('GET', '/api/v1/audit')).status).toBe(403);
  });
});
