import type { Knex } from 'knex';
import { afterAll, afterEach, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Alert, AlertWithEvents } from '../../api/src/contracts/alerts.js';
import type { Loop, ModelVersion } from '../../api/src/contracts/registry.js';
import type { LoopTrackingFields } from '../../api/src/contracts/twin.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { ENGINEER, ONCALL, REVIEWER, signedIn } from '../helpers/registry-fixtures.js';
import { tokenRequest, type SessionClient } from '../helpers/session-client.js';
import {
  eventually,
  insertPrediction,
  loopWithTwin,
  markTwinRunning,
  openDb,
  personalToken,
  postReadings,
  reading,
} from '../helpers/twin-fixtures.js';
import { collect, connected, twinSocket, type TwinSocket } from '../helpers/twin-socket.js';

/**
 * The whole path of a divergence, through the real api and database: readings posted with a token
 * are scored against the twin's predictions, the loop's drift rules judge them in the ingest
 * transaction, an alert is raised (socket alert:raised, tracking status diverged), its e-mail goes
 * through the outbox to the local mail capture, and readings back inside the band clear it.
 * The alert workers run in the api (mail sender every 100 ms; the sweep is called directly).
 */
const stack = inject('stack');
const ADMIN = 'admin@quillmere.example';
let api: RunningApi;
let db: Knex;
let engineer: SessionClient;
let oncall: SessionClient;
let admin: SessionClient;
let token: string;
const sockets: TwinSocket[] = [];

beforeAll(async () => {
  api = await startApi(stack, { MAIL_POLL_INTERVAL_MS: '100', ALERT_SWEEP_INTERVAL_MS: '3600000' });
  db = openDb(stack.databaseUrl);
  let reviewer: SessionClient;
  [engineer, reviewer, oncall, admin] = await Promise.all(
    [ENGINEER, REVIEWER, ONCALL, ADMIN].map((email) => signedIn(api.url, email)),
  );
  token = await personalToken(engineer, 'alerts ingest');
  twin = await loopWithTwin(engineer, reviewer);
  await markTwinRunning(db, twin.loop, twin.version);
  // the status stays about the rules here; the stale rule has its own test below
  await db('loops').where({ id: twin.loop.id }).update({ stale_after_samples: 600 });
});
afterEach(() => {
  for (const socket of sockets.splice(0)) socket.disconnect();
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

let twin: { loop: Loop; version: ModelVersion };
const PERIOD_MS = 1000;
let nextSlotMs = 0;

/** Stores the twin's prediction ŷ = 1 for the next slot and posts y = 1 + r: one sample of the plant. */
async function sample(r: number): Promise<number> {
  nextSlotMs = Math.max(nextSlotMs + PERIOD_MS, (Math.floor(Date.now() / PERIOD_MS) - 5) * PERIOD_MS);
  const slotMs = nextSlotMs;
  await insertPrediction(db, { loopId: twin.loop.id, versionId: twin.version.id, slotMs, x: [1, 0], y: [1] });
  const posted = await postReadings(api.url, token, twin.loop.id, [reading(slotMs, [0.5], [1 + r])]);
  expect(posted.body).toMatchObject({ accepted: 1, rejected: [] });
  return slotMs;
}

/** The SQL the api sends while `body` runs. */
async function statementsDuring<T>(body: () => Promise<T>): Promise<{ result: T; sql: string[] }> {
  const sql: string[] = [];
  const listen = (query: { sql: string }) => sql.push(query.sql);
  api.db.on('query', listen);
  try {
    return { result: await body(), sql };
  } finally {
    api.db.off('query', listen);
  }
}
const ASYNC_COMMIT = 'SET LOCAL synchronous_commit TO off';

const alertsOfLoop = async () =>
  (await oncall.request<Alert[]>('GET', `/api/v1/alerts?loopId=${twin.loop.id}&state=open`)).body;
const statusOf = async () =>
  (await engineer.request<LoopTrackingFields>('GET', `/api/v1/loops/${twin.loop.id}`)).body.status;

describe('a divergence from reading to e-mail', () => {
  it('raises one band alert after N samples outside the limit, mails the primary on call once, and clears after M inside', async () => {
    const saved = await engineer.request(
      'PUT',
      `/api/v1/loops/${twin.loop.id}/drift-rules/band`,
      {
        enabled: true,
        priority: 1,
        params: { mode: 'absolute', limits: [0.2], raiseAfter: 3, clearAfter: 2, deadband: 0.25 },
        note: 'alerts ingest test',
      },
      { csrf: true },
    );
    expect(saved.status).toBe(200);
    const socket = twinSocket(api.url, { token: await personalToken(oncall, 'alerts ingest socket') });
    sockets.push(socket);
    await connected(socket);
    const raised = collect(socket, 'alert:raised');

    // a batch of readings alone commits without waiting for the log flush
    const quiet = await statementsDuring(async () => {
      for (const r of [0.01, -0.02, 0.05]) await sample(r);
    });
    expect(quiet.sql.filter((s) => s === ASYNC_COMMIT)).toHaveLength(3);
    expect(await alertsOfLoop()).toEqual([]);
    expect(await statusOf()).toBe('in_step');

    // two samples outside: building up (drifting), no alert yet
    await sample(0.5);
    await sample(0.6);
    expect(await alertsOfLoop()).toEqual([]);
    expect(await statusOf()).toBe('drifting');

    // the batch that raises the alert (and queues its mail) waits for the flush like any other commit
    const raising = await statementsDuring(() => sample(0.7));
    const raisingSlot = raising.result;
    expect(raising.sql.some((s) => /insert into "?alerts"?/i.test(s))).toBe(true);
    expect(raising.sql).not.toContain(ASYNC_COMMIT);
    const [alert] = await alertsOfLoop();
    expect(alert).toMatchObject({
      rule: 'band',
      priority: 1,
      state: 'unacknowledged',
      active: true,
      loopId: twin.loop.id,
    });
    expect(alert.detail.slotAt).toBe(new Date(raisingSlot).toISOString());
    expect(alert.summary).toContain(twin.loop.outputs[0].name);
    expect(await statusOf()).toBe('diverged');
    await eventually(() => (raised.some((a) => a.id === alert.id) ? true : undefined), 'alert:raised at the socket');

    // the condition continues: still one alert, no second mail
    await sample(0.8);
    expect(await alertsOfLoop()).toHaveLength(1);

    const mails = await eventually(async () => {
      const all = (
        await admin.request<{ to: string[]; subject: string; text: string }[]>('GET', '/api/v1/dev/mail')
      ).body.filter((m) => m.subject.includes(twin.loop.tag));
      return all.length ? all : undefined;
    }, 'the alert e-mail in the local mailbox');
    expect(mails).toHaveLength(1);
    expect(mails[0].to).toEqual(['oncall@quillmere.example']);
    expect(mails[0].text).toContain(`/alerts/${alert.id}`);
    expect(mails[0].text).toMatch(/\/a\/[A-Za-z0-9_-]+\.[A-Za-z0-9_-]+/);
    expect(mails[0].text.toLowerCase()).toContain('advisory');
    // the sender marks the row sent once the SMTP server accepted it, a moment after the capture stored it
    const outbox = await eventually(async () => {
      const rows = await db('mail_outbox').where({ alert_id: alert.id });
      return rows.every((row) => row.sent_at !== null) ? rows : undefined;
    }, 'the outbox row marked sent');
    expect(outbox).toHaveLength(1);

    // inside the deadband (|r| < 0.2 · 0.75) for M = 2 samples: cleared before anyone acknowledged
    await sample(0.1);
    expect((await alertsOfLoop())[0].active).toBe(true);
    await sample(0.0);
    const [cleared] = await alertsOfLoop();
    expect(cleared).toMatchObject({ id: alert.id, state: 'returned_unacknowledged', active: false });
    expect(await statusOf()).toBe('in_step');
    const detail = (await oncall.request<AlertWithEvents>('GET', `/api/v1/alerts/${alert.id}`)).body;
    expect(detail.events.map((e) => e.kind)).toEqual(expect.arrayContaining(['raised', 'notified', 'cleared']));
  });

  it('raises the stale rule when readings stop, from the sweep, and clears it with the next reading', async () => {
    await engineer.request(
      'PUT',
      `/api/v1/loops/${twin.loop.id}/drift-rules/stale`,
      { enabled: true, priority: 3, params: { afterSamples: 3 }, note: 'alerts ingest test' },
      { csrf: true },
    );
    // the loop's tracking status turns stale at the same count
    expect((await db('loops').where({ id: twin.loop.id }).first('stale_after_samples')).stale_after_samples).toBe(3);
    await api.workers?.sweepOnce();
    expect((await alertsOfLoop()).find((a) => a.rule === 'stale')).toBeUndefined();
    // no reading for more than 3 samples of 1 s after the newest one
    await new Promise((resolve) => setTimeout(resolve, Math.max(0, nextSlotMs + 4500 - Date.now())));
    await api.workers?.sweepOnce();
    const stale = (await alertsOfLoop()).find((a) => a.rule === 'stale');
    expect(stale).toMatchObject({ state: 'unacknowledged', active: true, priority: 3 });
    await api.workers?.sweepOnce();
    expect((await alertsOfLoop()).filter((a) => a.rule === 'stale')).toHaveLength(1);
    await sample(0.0);
    expect((await alertsOfLoop()).find((a) => a.rule === 'stale')).toMatchObject({
      id: stale?.id,
      state: 'returned_unacknowledged',
      active: false,
    });
  });

  it('another api process sees a change at once: maintenance set on one, readings posted to the other are recorded, not alerted', async () => {
    const second = await startApi(stack, { ALERT_WORKERS: 'false' });
    try {
      // the second process has the loop and its rules in its caches
      await sample(0.0);
      await tokenRequest(second.url, token, 'POST', `/api/v1/loops/${twin.loop.id}/readings`, {
        readings: [reading(nextSlotMs - 500, [0.5], [1])],
      });
      const put = await oncall.request(
        'PUT',
        `/api/v1/loops/${twin.loop.id}/maintenance`,
        { maintenance: true, note: 'alerts ingest test: valve work' },
        { csrf: true },
      );
      expect(put.status).toBe(200);
      await new Promise((resolve) => setTimeout(resolve, 300));
      const openBefore = (await alertsOfLoop()).filter((a) => a.rule === 'band' && a.active).length;
      for (const r of [0.9, 0.9, 0.9]) {
        nextSlotMs = Math.max(nextSlotMs + PERIOD_MS, (Math.floor(Date.now() / PERIOD_MS) - 5) * PERIOD_MS);
        await insertPrediction(db, {
          loopId: twin.loop.id,
          versionId: twin.version.id,
          slotMs: nextSlotMs,
          x: [1, 0],
          y: [1],
        });
        const posted = await postReadings(second.url, token, twin.loop.id, [reading(nextSlotMs, [0.5], [1 + r])]);
        expect(posted.body).toMatchObject({ accepted: 1 });
      }
      expect((await alertsOfLoop()).filter((a) => a.rule === 'band' && a.active)).toHaveLength(openBefore);
      const suppressed = await db('alert_suppressions').where({ loop_id: twin.loop.id, rule_kind: 'band' });
      expect(suppressed.length).toBeGreaterThan(0);
    } finally {
      await oncall.request(
        'PUT',
        `/api/v1/loops/${twin.loop.id}/maintenance`,
        { maintenance: false, note: 'alerts ingest test: done' },
        { csrf: true },
      );
      await second.close();
    }
  });
});
