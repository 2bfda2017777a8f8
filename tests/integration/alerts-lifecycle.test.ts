import { randomBytes, randomUUID } from 'node:crypto';
import { createAdapter } from '@socket.io/postgres-adapter';
import { Server } from 'socket.io';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Alert, AlertSuppression, AlertWithEvents } from '../../api/src/contracts/alerts.js';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import { createDb, type Db } from '../../api/src/db/knex.js';
import { applyRuleTransitions, type AlertLoop } from '../../api/src/modules/alerts/alert-transitions.js';
import { expireShelves, publishAlertChanges, type AlertChange } from '../../api/src/modules/alerts/alerts.service.js';
import type { RuleTransition } from '../../api/src/modules/drift-rules/rule-runtime.js';
import { createTwinPublisher } from '../../api/src/realtime/publisher.js';
import { configureAlertMail } from '../../api/src/modules/mail/alert-mail.js';
import type { RealtimeServer } from '../../api/src/realtime/realtime-types.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import {
  act,
  approvedVersion,
  ENGINEER,
  ONCALL,
  OPERATOR,
  REVIEWER,
  signedIn,
  type ErrorResponse,
} from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import {
  eventually,
  loopWithTwin,
  personalToken,
  slotMsAgo,
  TWO_OUTPUT_MODEL,
  TWO_OUTPUTS,
} from '../helpers/twin-fixtures.js';
import { collect, connected, twinSocket, type TwinSocket } from '../helpers/twin-socket.js';
import { createPgPool } from '../../api/src/lib/pg-pool.js';

const stack = inject('stack');
const ADMIN = 'admin@quillmere.example';
let api: RunningApi;
let db: Db;
let engineer: SessionClient;
let reviewer: SessionClient;
let oncall: SessionClient;
let admin: SessionClient;
let operator: SessionClient;
let area: string;
let loop: Loop;
let version: ModelVersion;
let alertLoop: AlertLoop;
const rules: Record<'band' | 'cusum' | 'nis', string> = { band: '', cusum: '', nis: '' };
const sockets: TwinSocket[] = [];

const SIGMA = [0.1, 0.2];
const RULE_PARAMS = {
  band: { mode: 'absolute', limits: [0.3, 0.3], raiseAfter: 3, clearAfter: 3, deadband: 0.1 },
  cusum: { k: 0.5, h: 5, sigma: SIGMA, shift: 1 },
  nis: { falseAlarmProbability: 0.001, raiseAfter: 2, clearAfter: 2, sigma: SIGMA },
};

/** What the rule evaluator hands over when a rule crosses (rule-runtime.ts). */
function transition(
  kind: keyof typeof rules,
  event: 'raise' | 'clear',
  overrides: Partial<RuleTransition> = {},
): RuleTransition {
  const slotMs = slotMsAgo(1);
  return {
    ruleId: rules[kind],
    kind,
    ruleVersion: 1,
    priority: kind === 'nis' ? 1 : 2,
    event,
    slotMs,
    k: slotMs / 1000,
    statistic: { name: 'largest |residual| / limit', value: 1.7, limit: 1 },
    measured: [2.0, 1.5],
    predicted: [2.0, 1.0],
    residual: [0, 0.5],
    limits: kind === 'band' ? [0.3, 0.3] : null,
    ...overrides,
  };
}

const apply = (transitions: RuleTransition[], target: AlertLoop = alertLoop) =>
  db.transaction((trx) => applyRuleTransitions(trx, target, transitions, new Date()));

const getAlert = async (id: string) => {
  const response = await oncall.request<AlertWithEvents>('GET', `/api/v1/alerts/${id}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body;
};
const listAlerts = async (query: string) => {
  const response = await operator.request<Alert[]>('GET', `/api/v1/alerts?${query}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body;
};
const post = <T = Alert>(client: SessionClient, path: string, body: unknown) =>
  client.request<T & ErrorResponse>('POST', path, body, { csrf: true });
const outbox = (alertId: string, reason: string) =>
  db('mail_outbox')
    .where({ alert_id: alertId, reason })
    .count<{ count: string }[]>('* as count')
    .then(([r]) => Number(r.count));
const openAlertsOf = (kind: string) =>
  db('alerts').where({ loop_id: loop.id, rule_kind: kind }).whereNot('state', 'closed');

async function raised(kind: keyof typeof rules): Promise<string> {
  const changes = await apply([transition(kind, 'raise')]);
  const created = changes.find((c) => c.type === 'raised');
  if (!created) throw new Error(`no ${kind} alert was raised: ${JSON.stringify(changes)}`);
  return created.alertId;
}

async function closeOpen(kind: string): Promise<void> {
  for (const row of (await openAlertsOf(kind).select('id')) as { id: string }[]) {
    const response = await post(oncall, `/api/v1/alerts/${row.id}/close`, { cause: 'other', note: 'test tidy-up' });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
  }
}

beforeAll(async () => {
  api = await startApi(stack);
  // Raises here run in this process, outside the api's requests: mail needs its link settings set
  // in this module instance too (the same values startApi gives the api).
  configureAlertMail({ publicUrl: api.url, secret: 'integration-test-session-secret-0123456789' });
  db = createDb(stack.databaseUrl, 4);
  [engineer, reviewer, oncall, admin, operator] = await Promise.all(
    [ENGINEER, REVIEWER, ONCALL, ADMIN, OPERATOR].map((email) => signedIn(api.url, email)),
  );
  area = `alerts-test-${randomBytes(4).toString('hex')}`;
  await db('areas').insert({ id: area, name: `Alerts test ${area}`, sort_order: 99 });
  ({ loop, version } = await loopWithTwin(engineer, reviewer, { ...TWO_OUTPUTS, area }, TWO_OUTPUT_MODEL));
  alertLoop = { id: loop.id, tag: loop.tag, name: loop.name, area, maintenance: false, outputs: loop.outputs };
  for (const kind of Object.keys(rules) as (keyof typeof rules)[]) {
    const [row] = (await db('drift_rules')
      .insert({ loop_id: loop.id, kind, priority: 2, params: JSON.stringify(RULE_PARAMS[kind]) })
      .returning('id')) as { id: string }[];
    rules[kind] = row.id;
  }
  // the last 20 residuals as the ingest stores them: only Flow is off its prediction
  await db('predictions').insert(
    Array.from({ length: 20 }, (_, i) => {
      const slotMs = slotMsAgo(20 - i);
      return {
        loop_id: loop.id,
        slot_at: new Date(slotMs),
        k: slotMs / 1000,
        version_id: version.id,
        x: [2, 1],
        y: [2, 1],
        residual: [0.01 * (i % 2), 0.5],
      };
    }),
  );
});
afterEach(() => {
  while (sockets.length) sockets.pop()?.disconnect();
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

describe('raising and clearing', () => {
  it('raises one alert with the summary, values with units, the direction and its first event', async () => {
    const id = await raised('band');
    const alert = await getAlert(id);
    expect(alert).toMatchObject({
      loopId: loop.id,
      loopTag: loop.tag,
      area,
      rule: 'band',
      ruleId: rules.band,
      ruleVersion: 1,
      priority: 2,
      state: 'unacknowledged',
      active: true,
      activations: 1,
      summary: 'Flow measured 1.50 m³/h against 1.00 m³/h predicted for 3 samples (band 0.30 m³/h).',
    });
    expect(alert.detail.signals?.[1]).toEqual({
      name: 'Flow',
      unit: 'm³/h',
      measured: 1.5,
      predicted: 1,
      residual: 0.5,
      limit: 0.3,
    });
    expect(alert.direction?.points).toBe('sensor');
    expect(alert.direction?.hint).toMatch(
      /^Only Flow carries the residual \(\d+ % of it\): check its transmitter first\.$/,
    );
    expect(alert.events).toEqual([
      expect.objectContaining({ kind: 'raised', actor: null, fromState: null, toState: 'unacknowledged' }),
    ]);
    expect(await outbox(id, 'raised')).toBeGreaterThan(0);
  });

  it('keeps one open alert per rule while the condition continues, and re-raises it after a clear', async () => {
    const [open] = (await openAlertsOf('band').select('id')) as { id: string }[];
    expect(await apply([transition('band', 'raise')])).toEqual([]);
    expect(await openAlertsOf('band')).toHaveLength(1);

    expect(await apply([transition('band', 'clear')])).toEqual([{ alertId: open.id, type: 'updated' }]);
    expect(await getAlert(open.id)).toMatchObject({ state: 'returned_unacknowledged', active: false });
    const mailsBefore = await outbox(open.id, 'raised');
    expect(await apply([transition('band', 'raise')])).toEqual([{ alertId: open.id, type: 'updated' }]);
    const again = await getAlert(open.id);
    expect(again).toMatchObject({ state: 'unacknowledged', active: true, activations: 2, clearedAt: null });
    expect(again.events.map((e) => e.kind)).toEqual(['raised', 'cleared', 'reactivated']);
    // raisedAt stays the first raise; activeSince moves to the re-raise (what "for how long" counts from)
    expect(again.raisedAt).toBe(again.events[0].at);
    expect(again.activeSince).toBe(again.events[2].at);
    expect(Date.parse(again.activeSince)).toBeGreaterThan(Date.parse(again.raisedAt));
    // returned → unacknowledged calls nobody new
    expect(await outbox(open.id, 'raised')).toBe(mailsBefore);
    expect(await outbox(open.id, 'reactivated')).toBe(0);
    expect(await openAlertsOf('band')).toHaveLength(1);
  });

  it('lists alerts newest first with state, loop, area, priority and time filters', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    const nis = await raised('nis');
    const mine = await listAlerts(`loopId=${loop.id}&state=open`);
    expect(mine.map((a) => a.id).slice(0, 2)).toEqual([nis, band.id]);
    expect((await listAlerts(`area=${area}&priority=1`)).map((a) => a.id)).toEqual([nis]);
    expect((await listAlerts(`loopId=${loop.id}&state=acknowledged,closed`)).map((a) => a.id)).not.toContain(nis);
    const future = new Date(Date.now() + 3_600_000).toISOString();
    expect(await listAlerts(`loopId=${loop.id}&from=${encodeURIComponent(future)}`)).toEqual([]);
    const bad = await operator.request<ErrorResponse>('GET', '/api/v1/alerts?state=sleeping');
    expect(bad.status).toBe(400);
    // most urgent first: waiting alerts before handled and closed ones, P1 first among equals
    const urgency = (a: { state: string; active: boolean }) =>
      ['unacknowledged', 'returned_unacknowledged', 'acknowledged+', 'shelved', 'acknowledged', 'closed'].indexOf(
        a.state === 'acknowledged' && a.active ? 'acknowledged+' : a.state,
      );
    const urgent = await listAlerts(`area=${area}&order=urgent&limit=1000`);
    const ranks = urgent.map((a) => urgency(a) * 10 + a.priority);
    expect(ranks).toEqual([...ranks].sort((x, y) => x - y));
    expect(urgent[0].id).toBe(nis);
    expect((await operator.request('GET', '/api/v1/alerts?order=loudest')).status).toBe(400);
    expect((await operator.request('GET', `/api/v1/alerts/${randomUUID()}`)).status).toBe(404);
    await closeOpen('nis');
  });
});

describe('people acting on alerts', () => {
  it('acknowledges as on-call (403 for an operator), with event, audit and a 409 the second time', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    const refused = await post(operator, `/api/v1/alerts/${band.id}/acknowledge`, { note: 'seen' });
    expect(refused.status).toBe(403);
    const done = await post(oncall, `/api/v1/alerts/${band.id}/acknowledge`, { note: 'on my way' });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect(done.body).toMatchObject({ state: 'acknowledged', active: true, acknowledgedBy: { email: ONCALL } });
    const again = await post(admin, `/api/v1/alerts/${band.id}/acknowledge`, {});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_acknowledged');
    expect(again.body.error.message).toMatch(
      /^Alert #\d+ on IT-\w+: The alert is already acknowledged\. .+ acknowledged it at \d{4}-\d\d-\d\d \d\d:\d\d UTC\.$/,
    );
    const detail = await getAlert(band.id);
    expect(detail.events.at(-1)).toMatchObject({
      kind: 'acknowledged',
      note: 'on my way',
      actor: { email: ONCALL },
      details: { via: 'app' },
    });
    expect(await db('audit_log').where({ action: 'alert.acknowledged', target_id: band.id })).toHaveLength(1);
  });

  it('calls people again when an acknowledged alert clears and comes back', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    await apply([transition('band', 'clear')]);
    expect(await getAlert(band.id)).toMatchObject({ state: 'acknowledged', active: false });
    await apply([transition('band', 'raise')]);
    expect(await getAlert(band.id)).toMatchObject({
      state: 'unacknowledged',
      active: true,
      activations: 3,
      acknowledgedBy: null,
    });
    expect(await outbox(band.id, 'reactivated')).toBeGreaterThan(0);
  });

  it('lets exactly one of two simultaneous acknowledgements through', async () => {
    const id = await raised('cusum');
    const answers = await Promise.all([
      post(oncall, `/api/v1/alerts/${id}/acknowledge`, { note: 'first' }),
      post(admin, `/api/v1/alerts/${id}/acknowledge`, { note: 'second' }),
    ]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 409]);
    const events = (await getAlert(id)).events.filter((e) => e.kind === 'acknowledged');
    expect(events).toHaveLength(1);
    await closeOpen('cusum');
  });

  it('acknowledges in bulk and skips what cannot be acknowledged', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    const nis = await raised('nis');
    const response = await post<{ acknowledged: string[]; skipped: { id: string; reason: string }[] }>(
      oncall,
      '/api/v1/alerts/acknowledge',
      { ids: [band.id, nis, band.id], note: 'bulk' },
    );
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.acknowledged.sort()).toEqual([band.id, nis].sort());
    const second = await post<{ acknowledged: string[]; skipped: { id: string; reason: string }[] }>(
      oncall,
      '/api/v1/alerts/acknowledge',
      { ids: [nis] },
    );
    expect(second.body).toEqual({
      acknowledged: [],
      skipped: [{ id: nis, reason: expect.stringMatching(/already acknowledged/) }],
    });
    await closeOpen('nis');
  });

  it('refuses shelving without a reason, in the past or beyond the limit, and shelves within it', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    const path = `/api/v1/alerts/${band.id}/shelve`;
    const inHours = (h: number) => new Date(Date.now() + h * 3_600_000).toISOString();
    expect((await post(oncall, path, { until: inHours(1) })).status).toBe(400);
    const past = await post(oncall, path, { note: 'pump swap', until: inHours(-1) });
    expect([past.status, past.body.error.code]).toEqual([422, 'shelve_until_past']);
    const tooLong = await post(oncall, path, { note: 'pump swap', until: inHours(24 * 31) });
    expect([tooLong.status, tooLong.body.error.code]).toEqual([422, 'shelve_too_long']);
    expect((await post(operator, path, { note: 'pump swap', until: inHours(1) })).status).toBe(403);
    const shelved = await post(oncall, path, { note: 'pump swap', until: inHours(1) });
    expect(shelved.status, JSON.stringify(shelved.body)).toBe(200);
    expect(shelved.body).toMatchObject({ state: 'shelved', shelveReason: 'pump swap' });
    const ack = await post(oncall, `/api/v1/alerts/${band.id}/acknowledge`, {});
    expect([ack.status, ack.body.error.code]).toEqual([409, 'alert_shelved']);
  });

  it('ends shelving by itself when the time is over: back to unacknowledged while the condition lasts', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    const until = new Date(Date.now() + 1500).toISOString();
    expect((await post(oncall, `/api/v1/alerts/${band.id}/shelve`, { note: 'short look', until })).status).toBe(200);
    await new Promise((resolve) => setTimeout(resolve, 1700));
    const publisher = createTwinPublisher();
    await expireShelves(db, publisher, new Date());
    // another api's sweep may have ended it first; either way exactly once
    const after = await getAlert(band.id);
    expect(after).toMatchObject({ state: 'unacknowledged', active: true, shelvedUntil: null });
    expect(after.events.filter((e) => e.kind === 'unshelved')).toHaveLength(1);
    expect(await outbox(band.id, 'shelve_expired')).toBeGreaterThan(0);
    await expireShelves(db, publisher, new Date());
    expect((await getAlert(band.id)).events.filter((e) => e.kind === 'unshelved')).toHaveLength(1);
  });

  it('closes with a cause and a note; a new raise then opens a new alert', async () => {
    const band = (await openAlertsOf('band').first('id')) as { id: string };
    const path = `/api/v1/alerts/${band.id}/close`;
    expect((await post(oncall, path, { cause: 'sensor_fault' })).status).toBe(400);
    expect((await post(oncall, path, { cause: 'not-a-cause', note: 'x' })).status).toBe(400);
    const closed = await post(oncall, path, { cause: 'sensor_fault', note: 'Flow transmitter recalibrated' });
    expect(closed.status, JSON.stringify(closed.body)).toBe(200);
    expect(closed.body).toMatchObject({
      state: 'closed',
      active: false,
      closeCause: 'sensor_fault',
      closedBy: { email: ONCALL },
    });
    expect((await post(oncall, path, { cause: 'other', note: 'again' })).status).toBe(409);
    expect(await db('audit_log').where({ action: 'alert.closed', target_id: band.id })).toHaveLength(1);
    const fresh = await raised('band');
    expect(fresh).not.toBe(band.id);
    await closeOpen('band');
  });
});

describe('maintenance', () => {
  it('records raises while the loop is in maintenance and calls nobody', async () => {
    const path = `/api/v1/loops/${loop.id}/maintenance`;
    expect((await operator.request('PUT', path, { maintenance: true, note: 'WO-1' }, { csrf: true })).status).toBe(403);
    const on = await engineer.request(
      'PUT',
      path,
      { maintenance: true, note: 'WO-1 diffuser cleaning' },
      { csrf: true },
    );
    expect(on.status, JSON.stringify(on.body)).toBe(200);
    expect(on.body).toEqual({ loopId: loop.id, loopTag: loop.tag, maintenance: true });
    const { maintenance } = (await db('loops').where({ id: loop.id }).first('maintenance')) as { maintenance: boolean };
    expect(maintenance).toBe(true);

    expect(await apply([transition('cusum', 'raise')], { ...alertLoop, maintenance })).toEqual([]);
    expect(await openAlertsOf('cusum')).toHaveLength(0);
    const suppressed = await operator.request<AlertSuppression[]>('GET', `/api/v1/loops/${loop.id}/alert-suppressions`);
    expect(suppressed.status).toBe(200);
    expect(suppressed.body[0]).toMatchObject({
      loopId: loop.id,
      rule: 'cusum',
      summary: expect.stringContaining('CUSUM'),
    });

    const off = await oncall.request('PUT', path, { maintenance: false, note: 'work done' }, { csrf: true });
    expect(off.status).toBe(200);
    const audits = await db('audit_log')
      .where({ target_id: loop.id })
      .whereIn('action', ['loop.maintenance_started', 'loop.maintenance_ended']);
    expect(audits.map((a: { action: string }) => a.action)).toEqual([
      'loop.maintenance_started',
      'loop.maintenance_ended',
    ]);
  });
});

describe('live alert events', () => {
  it('reaches a signed-in socket as alert:raised and alert:updated through the adapter', async () => {
    const socket = twinSocket(api.url, { token: await personalToken(oncall, 'alert socket') });
    sockets.push(socket);
    await connected(socket);
    const raisedSeen = collect(socket, 'alert:raised');
    const updatedSeen = collect(socket, 'alert:updated');
    // a second process on the same adapter, as the ingest of another api process would publish
    const adapterPool = createPgPool(stack.databaseUrl, 2);
    const io: RealtimeServer = new Server({ adapter: createAdapter(adapterPool) });
    const publisher = createTwinPublisher();
    publisher.attach(io);
    try {
      const changes: AlertChange[] = await apply([transition('nis', 'raise')]);
      await publishAlertChanges(db, publisher, changes);
      const id = changes[0].alertId;
      const event = await eventually(() => raisedSeen.find((a) => a.id === id), 'alert:raised');
      expect(event).toMatchObject({ id, loopId: loop.id, area, state: 'unacknowledged', priority: 1, rule: 'nis' });
      // the api publishes the people's changes itself
      expect((await post(oncall, `/api/v1/alerts/${id}/acknowledge`, {})).status).toBe(200);
      const updated = await eventually(() => updatedSeen.find((a) => a.id === id), 'alert:updated');
      expect(updated).toMatchObject({ state: 'acknowledged', acknowledgedBy: { email: ONCALL } });
    } finally {
      publisher.attach(null);
      await io.of('/').adapter.close();
      await adapterPool.end();
    }
    await closeOpen('nis');
  });
});

describe('model warning', () => {
  it('raises a priority 1 model alert when an unstable version becomes active and clears it for a stable one', async () => {
    const unstable = {
      A: [
        [1.05, 0],
        [0, 0.7],
      ],
      B: [[0], [0.3]],
      C: [[1, 0]],
    };
    const { loop: shaky } = await loopWithTwin(engineer, reviewer, { area }, unstable);
    const [warning] = await listAlerts(`loopId=${shaky.id}`);
    expect(warning).toMatchObject({ rule: 'model', priority: 1, state: 'unacknowledged', active: true, ruleId: null });
    expect(warning.summary).toMatch(/^The active model itself diverges: version 1 has spectral radius 1\.0500/);
    const stable = await approvedVersion(engineer, reviewer, shaky.id);
    expect((await act(reviewer, stable.id, 'activate', { acknowledgeCautions: true })).status).toBe(200);
    const after = await getAlert(warning.id);
    expect(after).toMatchObject({ state: 'returned_unacknowledged', active: false });
    expect(after.events.map((e) => e.kind)).toEqual(['raised', 'cleared']);
  });

  it('clears the model alert when the unstable active version is retired and no version runs', async () => {
    const unstable = {
      A: [
        [1.02, 0],
        [0, 0.5],
      ],
      B: [[0], [0.3]],
      C: [[1, 0]],
    };
    const { loop: shaky, version } = await loopWithTwin(engineer, reviewer, { area }, unstable);
    const [warning] = await listAlerts(`loopId=${shaky.id}`);
    expect(warning).toMatchObject({ rule: 'model', active: true });
    const retired = await act(reviewer, version.id, 'retire', { note: 'taken out of service' });
    expect(retired.status).toBe(200);
    expect(await getAlert(warning.id)).toMatchObject({ state: 'returned_unacknowledged', active: false });
  });
});
