import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { DriftRule, DriftRuleSuggestion, RuleExpectation } from '../../api/src/contracts/alerts.js';
import type { Loop } from '../../api/src/contracts/registry.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { createLoop, ENGINEER, OPERATOR, signedIn, type ErrorResponse } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import { openDb } from '../helpers/twin-fixtures.js';
import { seed as seedDemoRules } from '../../seeds/03_drift_rules_demo.js';

const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let engineer: SessionClient;
let operator: SessionClient;
let loop: Loop;
let twoOutputs: Loop;

const two = {
  states: [
    { name: 'Level 1', unit: 'm' },
    { name: 'Level 2', unit: 'm' },
  ],
  outputs: [
    { name: 'Level 1', unit: 'm' },
    { name: 'Level 2', unit: 'm' },
  ],
};
const cusumBody = {
  enabled: true,
  priority: 2,
  params: { k: 0.5, h: 5, sigma: [0.02], shift: 1 },
  note: 'first tuning',
};

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  [engineer, operator] = await Promise.all([ENGINEER, OPERATOR].map((email) => signedIn(api.url, email)));
  loop = await createLoop(engineer, { samplePeriodS: 10 });
  twoOutputs = await createLoop(engineer, two);
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

const rulesOf = (client: SessionClient, loopId: string) =>
  client.request<DriftRule[]>('GET', `/api/v1/loops/${loopId}/drift-rules`);
const save = (client: SessionClient, loopId: string, kind: string, body: unknown) =>
  client.request<DriftRule>('PUT', `/api/v1/loops/${loopId}/drift-rules/${kind}`, body, { csrf: true });

describe('drift rules', () => {
  it('a new loop starts with its stale rule, with the sentence of what it does', async () => {
    const listed = await rulesOf(operator, loop.id);
    expect(listed.status).toBe(200);
    expect(listed.body).toHaveLength(1);
    expect(listed.body[0]).toMatchObject({
      kind: 'stale',
      enabled: true,
      priority: 3,
      version: 1,
      params: { afterSamples: 5 },
      expectation: { falseAlertIntervalSamples: null },
    });
    expect(listed.body[0].expectation.sentence).toContain('5 samples (50 seconds at this sample period)');
    const versions = await db('drift_rule_versions').where({ rule_id: listed.body[0].id });
    expect(versions).toHaveLength(1);
  });

  it('saving creates version 1, saving again version 2; both are listed and audited with before and after', async () => {
    const first = await save(engineer, loop.id, 'cusum', cusumBody);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ kind: 'cusum', version: 1, priority: 2, updatedBy: expect.any(String) });
    expect(first.body.expectation.falseAlertIntervalSamples).toBeGreaterThan(400);
    expect(first.body.expectation.detectionDelaySamples).toBeGreaterThan(9);
    const second = await save(engineer, loop.id, 'cusum', {
      ...cusumBody,
      priority: 1,
      params: { ...cusumBody.params, h: 4 },
      note: 'faster',
    });
    expect(second.body).toMatchObject({ version: 2, priority: 1, params: { h: 4 } });

    const versions = await operator.request<{ version: number; note: string; params: { h: number } }[]>(
      'GET',
      `/api/v1/loops/${loop.id}/drift-rules/cusum/versions`,
    );
    expect(versions.body.map((v) => [v.version, v.note, v.params.h])).toEqual([
      [2, 'faster', 4],
      [1, 'first tuning', 5],
    ]);
    const audit = await db('audit_log')
      .where({ action: 'drift_rule.saved', target_id: second.body.id })
      .orderBy('id', 'desc')
      .first();
    expect(audit.details).toMatchObject({
      loopId: loop.id,
      kind: 'cusum',
      version: 2,
      before: { priority: 2, params: { h: 5 } },
      after: { priority: 1, params: { h: 4 } },
    });
    expect((await rulesOf(operator, loop.id)).body.map((r) => r.kind)).toEqual(['cusum', 'stale']);
  });

  it('refuses bad settings with a message naming the field', async () => {
    const short = await save(engineer, twoOutputs.id, 'band', {
      enabled: true,
      priority: 2,
      params: { mode: 'absolute', limits: [0.1], raiseAfter: 3, clearAfter: 5, deadband: 0.2 },
    });
    expect(short.status).toBe(400);
    const error = (short.body as unknown as ErrorResponse<{ path: string }[]>).error;
    expect(error.message).toContain('params.limits has 1 value, the loop has 2 outputs');
    expect(error.details.map((d) => d.path)).toContain('body.params.limits');

    const missing = await save(engineer, loop.id, 'nis', { enabled: true, priority: 3, params: { raiseAfter: 2 } });
    expect(missing.status).toBe(400);
    expect((missing.body as unknown as ErrorResponse).error.message).toContain('params.falseAlarmProbability');

    const noCovariance = await save(engineer, loop.id, 'nis', {
      enabled: true,
      priority: 3,
      params: { falseAlarmProbability: 0.001, raiseAfter: 2, clearAfter: 2 },
    });
    expect(noCovariance.status).toBe(400);
    expect((noCovariance.body as unknown as ErrorResponse).error.message).toContain('params.sigma is needed');

    const unknownKind = await save(engineer, loop.id, 'ewma', cusumBody);
    expect(unknownKind.status).toBe(404);
    expect((await db('drift_rules').where({ loop_id: twoOutputs.id, kind: 'band' })).length).toBe(0);
  });

  it('only engineers change rules, preview or ask for a suggestion', async () => {
    expect((await save(operator, loop.id, 'cusum', cusumBody)).status).toBe(403);
    const preview = await operator.request('POST', `/api/v1/loops/${loop.id}/drift-rules/preview`, {}, { csrf: true });
    expect(preview.status).toBe(403);
    expect((await operator.request('GET', `/api/v1/loops/${loop.id}/drift-rules/suggest`)).status).toBe(403);
  });

  it('previews the expectation of unsaved settings without saving them', async () => {
    const preview = await engineer.request<RuleExpectation>(
      'POST',
      `/api/v1/loops/${twoOutputs.id}/drift-rules/preview`,
      {
        kind: 'band',
        params: { mode: 'sigma', k: 3, sigma: [0.01, 0.02], raiseAfter: 1, clearAfter: 5, deadband: 0.2 },
      },
      { csrf: true },
    );
    expect(preview.status).toBe(200);
    // two outputs, each outside 3σ with probability 0.0027 (two-sided): about one sample in 185
    expect(preview.body.falseAlertIntervalSamples).toBeGreaterThan(180);
    expect(preview.body.falseAlertIntervalSamples).toBeLessThan(190);
    expect(preview.body.sentence).toMatch(/^About one false alert every .+ at this sample period/);
    const bad = await engineer.request(
      'POST',
      `/api/v1/loops/${twoOutputs.id}/drift-rules/preview`,
      { kind: 'cusum', params: { k: 0.5, h: 5, sigma: [1, 2, 3] } },
      { csrf: true },
    );
    expect(bad.status).toBe(400);
    expect((await rulesOf(engineer, twoOutputs.id)).body.map((r) => r.kind)).toEqual(['stale']);
  });

  it('suggests sigma from the running residual statistics once there are enough', async () => {
    const url = `/api/v1/loops/${twoOutputs.id}/drift-rules/suggest`;
    const none = await engineer.request<DriftRuleSuggestion>('GET', url);
    expect(none.status).toBe(200);
    expect(none.body).toMatchObject({ residualCount: 0, sigma: null });
    // Welford's M2 = (n − 1)·s²: 100 residuals with s = 0.02 and 0.5
    await db('loop_tracking')
      .insert({
        loop_id: twoOutputs.id,
        residual_count: 100,
        residual_mean: [0.001, -0.1],
        residual_m2: [99 * 0.02 ** 2, 99 * 0.5 ** 2],
      })
      .onConflict('loop_id')
      .merge();
    const some = await engineer.request<DriftRuleSuggestion>('GET', url);
    expect(some.body.residualCount).toBe(100);
    expect(some.body.sigma).toEqual([0.02, 0.5]);
    expect(some.body.outputs.map((o) => o.mean)).toEqual([0.001, -0.1]);
  });

  it('answers 404 for a loop that does not exist', async () => {
    const missing = await rulesOf(engineer, '00000000-0000-4000-8000-000000000000');
    expect(missing.status).toBe(404);
  });

  it('the demo seed gives each demo loop its four rules, NIS on only where the correction is kalman, and adds nothing twice', async () => {
    const rows = (await db('drift_rules as r')
      .join('loops as l', 'l.id', 'r.loop_id')
      .whereIn('l.tag', ['AER-DO-101', 'DIG-TT-301'])
      .select('l.tag', 'r.kind', 'r.enabled', 'r.priority')
      .orderBy(['l.tag', 'r.kind'])) as { tag: string; kind: string; enabled: boolean; priority: number }[];
    expect(rows.map((r) => `${r.tag} ${r.kind} ${r.enabled ? 'on' : 'off'} ${r.priority}`)).toEqual([
      'AER-DO-101 band on 2',
      'AER-DO-101 cusum on 2',
      'AER-DO-101 nis off 3',
      'AER-DO-101 stale on 1',
      'DIG-TT-301 band on 2',
      'DIG-TT-301 cusum on 2',
      'DIG-TT-301 nis on 3',
      'DIG-TT-301 stale on 1',
    ]);
    const versions = async () =>
      Number(
        (
          await db('drift_rule_versions as v')
            .join('drift_rules as r', 'r.id', 'v.rule_id')
            .join('loops as l', 'l.id', 'r.loop_id')
            .whereIn('l.tag', ['AER-DO-101', 'STO-LT-201', 'DIG-TT-301', 'DIS-CL-401'])
            .count<{ count: string }[]>('* as count')
        )[0].count,
      );
    const before = await versions();
    expect(before).toBeGreaterThanOrEqual(16);
    await seedDemoRules(db);
    expect(await versions()).toBe(before);
  });
});
