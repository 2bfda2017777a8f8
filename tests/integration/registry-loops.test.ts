import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Area, Loop } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  createDraft,
  createLoop,
  ENGINEER,
  loopBody,
  ONCALL,
  OPERATOR,
  signedIn,
  uniqueTag,
  type ErrorResponse,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';

const stack = inject('stack');
let api: RunningApi;
let engineer: SessionClient;
let operator: SessionClient;
let oncall: SessionClient;

beforeAll(async () => {
  api = await startApi(stack);
  [engineer, operator, oncall] = await Promise.all(
    [ENGINEER, OPERATOR, ONCALL].map((email) => signedIn(api.url, email)),
  );
});
afterAll(async () => {
  await api.close();
});

describe('areas and the seeded loops', () => {
  it('lists the demo areas in display order to anyone signed in', async () => {
    const response = await operator.request<Area[]>('GET', '/api/v1/areas');
    expect(response.status).toBe(200);
    const demo = ['Aeration', 'Storage', 'Digestion', 'Disinfection'];
    expect(response.body.map((a) => a.name).filter((name) => demo.includes(name))).toEqual(demo);
  });

  it('lists loops with their active version and waiting versions, filtered by area and status', async () => {
    const all = await operator.request<Loop[]>('GET', '/api/v1/loops');
    const aeration = all.body.find((loop) => loop.tag === 'AER-DO-101') as Loop;
    expect(aeration).toMatchObject({
      area: 'aeration',
      areaName: 'Aeration',
      status: 'no_twin',
      activeVersionNumber: 1,
      inReviewCount: 1,
      draftCount: 0,
    });
    expect(aeration.activeVersionId).toMatch(/^[0-9a-f-]{36}$/);
    const digestion = (await operator.request<Loop[]>('GET', '/api/v1/loops?area=digestion')).body;
    expect(digestion.map((loop) => loop.tag)).toContain('DIG-TT-301');
    expect(digestion.every((loop) => loop.area === 'digestion')).toBe(true);
    for (const status of ['no_twin', 'diverged']) {
      const filtered = (await operator.request<Loop[]>('GET', `/api/v1/loops?status=${status}`)).body;
      expect(filtered.length).toBe(all.body.filter((loop) => loop.status === status).length);
      expect(filtered.every((loop) => loop.status === status)).toBe(true);
    }
    expect((await operator.request('GET', '/api/v1/loops?status=sideways')).status).toBe(400);
  });

  it('shows one loop with its signals and operating point, 404 for an unknown one', async () => {
    const [first] = (await operator.request<Loop[]>('GET', '/api/v1/loops?area=storage')).body;
    const one = await operator.request<Loop>('GET', `/api/v1/loops/${first.id}`);
    expect(one.body).toMatchObject({
      tag: first.tag,
      inputs: first.inputs,
      states: first.states,
      outputs: first.outputs,
      operatingPoint: first.operatingPoint,
    });
    expect((await operator.request('GET', '/api/v1/loops/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await operator.request('GET', '/api/v1/loops/not-a-uuid')).status).toBe(404);
  });
});

describe('registering a loop (engineer)', () => {
  it('creates a loop with 201 and refuses operators and on-call engineers', async () => {
    const body = loopBody({ operatingPoint: { x0: [2, 10], u0: [50], y0: [2] }, timeZone: 'Europe/London' });
    const created = await engineer.request<Loop>('POST', '/api/v1/loops', body, { csrf: true });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      tag: body.tag,
      status: 'no_twin',
      activeVersionId: null,
      draftCount: 0,
      timeZone: 'Europe/London',
    });
    for (const client of [operator, oncall]) {
      expect((await client.request('POST', '/api/v1/loops', loopBody(), { csrf: true })).status).toBe(403);
    }
  });

  it('answers 409 for a tag that is taken', async () => {
    const response = await engineer.request<ErrorResponse>('POST', '/api/v1/loops', loopBody({ tag: 'AER-DO-101' }), {
      csrf: true,
    });
    expect(response.status).toBe(409);
    expect(response.body.error.message).toContain('AER-DO-101');
  });

  it('lists every field problem: operating point lengths, unknown area, unknown time zone', async () => {
    const body = loopBody({
      area: 'moon-base',
      timeZone: 'Mars/Olympus',
      operatingPoint: { x0: [1], u0: [1, 2], y0: [1] },
    });
    const response = await engineer.request<ErrorResponse<{ path: string; message: string }[]>>(
      'POST',
      '/api/v1/loops',
      body,
      { csrf: true },
    );
    expect(response.status).toBe(400);
    expect(response.body.error.details.map((d) => d.path).sort()).toEqual([
      'body.area',
      'body.operatingPoint.u0',
      'body.operatingPoint.x0',
      'body.timeZone',
    ]);
  });

  it('refuses a malformed tag and empty signal lists with the fields named', async () => {
    const response = await engineer.request<ErrorResponse<{ path: string }[]>>(
      'POST',
      '/api/v1/loops',
      loopBody({ tag: 'lower case', inputs: [] }),
      { csrf: true },
    );
    expect(response.status).toBe(400);
    expect(response.body.error.details.map((d) => d.path)).toEqual(expect.arrayContaining(['body.tag', 'body.inputs']));
  });
});

describe('changing a loop (engineer)', () => {
  it('changes only the fields sent', async () => {
    const loop = await createLoop(engineer, {
      description: 'kept',
      timeZone: 'Europe/Paris',
      operatingPoint: { u0: [40] },
    });
    const response = await engineer.request<Loop>(
      'PATCH',
      `/api/v1/loops/${loop.id}`,
      { name: 'Renamed' },
      { csrf: true },
    );
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({
      name: 'Renamed',
      description: 'kept',
      timeZone: 'Europe/Paris',
      operatingPoint: { u0: [40] },
    });
    expect((await operator.request('PATCH', `/api/v1/loops/${loop.id}`, { name: 'x' }, { csrf: true })).status).toBe(
      403,
    );
  });

  it('allows new signal counts until a model version exists, then answers 409 in plain words', async () => {
    const loop = await createLoop(engineer);
    const threeStates = [...loop.states, { name: 'Temperature', unit: '°C' }];
    expect(
      (await engineer.request('PATCH', `/api/v1/loops/${loop.id}`, { states: threeStates }, { csrf: true })).status,
    ).toBe(200);
    await engineer.request('PATCH', `/api/v1/loops/${loop.id}`, { states: loop.states }, { csrf: true });
    await createDraft(engineer, loop.id);
    const renamed = loop.states.map((s) => ({ ...s, name: `${s.name} (renamed)` }));
    expect(
      (await engineer.request('PATCH', `/api/v1/loops/${loop.id}`, { states: renamed }, { csrf: true })).status,
    ).toBe(200);
    const locked = await engineer.request<ErrorResponse>(
      'PATCH',
      `/api/v1/loops/${loop.id}`,
      { states: threeStates },
      { csrf: true },
    );
    expect(locked.status).toBe(409);
    expect(locked.body.error.message).toMatch(
      /already has model versions, so the number of states \(2 → 3\) cannot change/,
    );
    expect(
      (await engineer.request('PATCH', `/api/v1/loops/${loop.id}`, { samplePeriodS: 5 }, { csrf: true })).status,
    ).toBe(409);
  });

  it('answers 409 when renaming to a tag that is taken, 404 for an unknown loop', async () => {
    const loop = await createLoop(engineer);
    expect(
      (await engineer.request('PATCH', `/api/v1/loops/${loop.id}`, { tag: 'STO-LT-201' }, { csrf: true })).status,
    ).toBe(409);
    const unknown = await engineer.request(
      'PATCH',
      '/api/v1/loops/00000000-0000-4000-8000-000000000000',
      { tag: uniqueTag() },
      { csrf: true },
    );
    expect(unknown.status).toBe(404);
  });
});
