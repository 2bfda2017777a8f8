import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { AlertLoad } from '../../api/src/contracts/alerts.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { OPERATOR, signedIn, type ErrorResponse } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import { openDb } from '../helpers/twin-fixtures.js';

/**
 * The alert-load report over a fixed period long past (1–3 March 2025), so that the alerts other
 * suites raise now never count. The alerts and their timelines are written straight to the tables;
 * every expected figure is counted by hand from the timeline below.
 */
const stack = inject('stack');
let api: RunningApi;
let db: Knex;
let operator: SessionClient;
let area: string;
const loops: Record<string, { id: string; tag: string }> = {};
const alertIds: Record<string, string> = {};
const PERIOD = 'from=2025-03-01T00:00:00Z&to=2025-03-03T00:00:00Z';

/** 1 March 2025 at hh:mm:ss UTC (day 2 = 2 March, day 0 = 28 February). */
const t = (hhmmss: string, day = 1) => new Date(`2025-0${day === 0 ? '2-28' : `3-0${day}`}T${hhmmss}Z`);
type Event = [kind: string, at: Date];

async function insertLoop(name: string): Promise<void> {
  const [row] = await db('loops')
    .insert({
      tag: `LD-${name}-${randomBytes(3).toString('hex').toUpperCase()}`,
      name: `Load test ${name}`,
      area_id: area,
      sample_period_s: 1,
      inputs: JSON.stringify([{ name: 'u', unit: '%' }]),
      states: JSON.stringify([{ name: 'x', unit: 'm' }]),
      outputs: JSON.stringify([{ name: 'y', unit: 'm' }]),
    })
    .returning<{ id: string; tag: string }[]>(['id', 'tag']);
  loops[name] = row;
}

/**
 * One alert and its timeline. Alerts still open are acknowledged and marked as notified and fully
 * escalated, so no mail or escalation worker acts on them.
 */
async function insertAlert(
  name: string,
  loop: string,
  rule: string,
  events: Event[],
  closedAt: Date | null,
): Promise<void> {
  const raisedAt = events[0][1];
  const acked = events.find(([kind]) => kind === 'acknowledged')?.[1];
  const [{ id }] = await db('alerts')
    .insert({
      loop_id: loops[loop].id,
      area_id: area,
      rule_kind: rule,
      priority: 2,
      state: closedAt ? 'closed' : 'acknowledged',
      active: !closedAt,
      raised_at: raisedAt,
      acknowledged_at: acked ?? (closedAt ? null : raisedAt),
      closed_at: closedAt,
      close_cause: closedAt ? 'other' : null,
      summary: `load test ${name}`,
      escalation_level: 2,
      notified_at: raisedAt,
    })
    .returning<{ id: string }[]>('id');
  await db('alert_events').insert(events.map(([kind, at]) => ({ alert_id: id, kind, at })));
  alertIds[name] = id;
}

/** `count` alerts on one loop, one raise each, a second apart from `start`, closed a minute later. */
async function burst(loop: string, start: Date, count: number): Promise<void> {
  for (let i = 0; i < count; i++) {
    const raised = new Date(start.getTime() + i * 1000);
    const closed = new Date(raised.getTime() + 60_000);
    await insertAlert(
      `${loop}-burst-${start.toISOString()}-${i}`,
      loop,
      'band',
      [
        ['raised', raised],
        ['closed', closed],
      ],
      closed,
    );
  }
}

/*
 * Timeline (1 March unless said). Activations (raised/reactivated) per 10-minute window:
 *   00:00  E reactivated 00:00:10 (cleared 28 Feb 23:59:30: back within 40 s → chattering 1)   1
 *   01:00  S3 raised (cleared 02:00)                                                            1
 *   03:00  S4 raised (acknowledged 03:05, cleared 03:30)                                        1
 *   08:00  C raised 08:00:00, back 08:01:00 (30 s after clearing), 08:04:00 (120 s: not
 *          chattering), 08:05:10 (60 s) → 4 activations, chattering 2; A raised (ack 08:02);
 *          7 alerts on L1 08:03:00–08:03:06                                                   12
 *   08:10  11 alerts on L3                                                                     11
 *   08:30  10 alerts on L6 (over the target of 1, not over the flood limit of 10)              10
 *   09:00  B raised (acknowledged 09:10 and again 09:20) and 10 alerts on L5                   11
 *   10:00  S raised (acknowledged 10:20), never cleared                                         1
 *   20:00  S4 back (cleared at 03:30, so not chattering), never cleared again                   1
 *   2 March 12:00  S2 raised (acknowledged 12:30), never cleared                                1
 * Outside the period: E raised 28 Feb 23:00 (acknowledged 1 March 00:01), and a raise at
 * 3 March 00:00:00 exactly (the period is half-open).
 * Total 50: 49 on 1 March, 1 on 2 March. Per loop: L3 12, L5 11, L6 10, L1 8, L2 5 (C 4, S3 1), L4 4.
 * Over target: 4 of 288 windows. Floods (> 10): 08:00–08:20 (12 + 11 = 23) and 09:00–09:10 (11).
 * Stale on 3 March 00:00: S (active since 1 March 10:00, 38 h), S4 (since 20:00, 28 h); S2 is 12 h.
 * Time to acknowledge, alerts raised in the period: A 120 s, B 600 s, S4 300 s, S 1200 s,
 * S2 1800 s → mean 4020 / 5 = 804 s.
 */
async function writeTimeline(): Promise<void> {
  for (const name of ['L1', 'L2', 'L3', 'L4', 'L5', 'L6', 'L7']) await insertLoop(name);
  await insertAlert(
    'E',
    'L3',
    'nis',
    [
      ['raised', t('23:00:00', 0)],
      ['cleared', t('23:59:30', 0)],
      ['reactivated', t('00:00:10')],
      ['acknowledged', t('00:01:00')],
      ['cleared', t('00:05:00')],
      ['closed', t('00:30:00')],
    ],
    t('00:30:00'),
  );
  await insertAlert(
    'S3',
    'L2',
    'cusum',
    [
      ['raised', t('01:00:00')],
      ['cleared', t('02:00:00')],
      ['closed', t('02:10:00')],
    ],
    t('02:10:00'),
  );
  await insertAlert(
    'S4',
    'L4',
    'nis',
    [
      ['raised', t('03:00:00')],
      ['acknowledged', t('03:05:00')],
      ['cleared', t('03:30:00')],
      ['reactivated', t('20:00:00')],
    ],
    null,
  );
  await insertAlert(
    'C',
    'L2',
    'band',
    [
      ['raised', t('08:00:00')],
      ['cleared', t('08:00:30')],
      ['reactivated', t('08:01:00')],
      ['cleared', t('08:02:00')],
      ['reactivated', t('08:04:00')],
      ['cleared', t('08:04:10')],
      ['reactivated', t('08:05:10')],
      ['cleared', t('08:06:00')],
      ['closed', t('08:30:00')],
    ],
    t('08:30:00'),
  );
  await insertAlert(
    'A',
    'L1',
    'nis',
    [
      ['raised', t('08:00:00')],
      ['acknowledged', t('08:02:00')],
      ['closed', t('12:00:00')],
    ],
    t('12:00:00'),
  );
  await burst('L1', t('08:03:00'), 7);
  await burst('L3', t('08:10:00'), 11);
  await burst('L6', t('08:30:00'), 10);
  await insertAlert(
    'B',
    'L5',
    'cusum',
    [
      ['raised', t('09:00:00')],
      ['acknowledged', t('09:10:00')],
      ['acknowledged', t('09:20:00')],
      ['cleared', t('09:30:00')],
      ['closed', t('10:00:00')],
    ],
    t('10:00:00'),
  );
  await burst('L5', t('09:00:01'), 10);
  await insertAlert(
    'S',
    'L4',
    'stale',
    [
      ['raised', t('10:00:00')],
      ['acknowledged', t('10:20:00')],
    ],
    null,
  );
  await insertAlert(
    'S2',
    'L4',
    'cusum',
    [
      ['raised', t('12:00:00', 2)],
      ['acknowledged', t('12:30:00', 2)],
    ],
    null,
  );
  await burst('L7', t('00:00:00', 3), 1);
}

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  operator = await signedIn(api.url, OPERATOR);
  area = `load-test-${randomBytes(4).toString('hex')}`;
  await db('areas').insert({ id: area, name: `Load test ${area}`, sort_order: 99 });
  await writeTimeline();
});
afterAll(async () => {
  // Close what this file left open, so reports of the present never list these alerts as stale.
  await db('alerts')
    .where({ area_id: area })
    .whereNull('closed_at')
    .update({ state: 'closed', active: false, closed_at: db.fn.now(), close_cause: 'other' });
  await db.destroy();
  await api.close();
});

const report = async (query = PERIOD) => {
  const response = await operator.request<AlertLoad>('GET', `/api/v1/alerts/load?${query}`);
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  return response.body;
};

describe('the alert-load report', () => {
  it('works against the default targets', async () => {
    expect((await report()).targets).toEqual({ perDay: 144, per10Min: 1, floodPer10Min: 10 });
  });

  it('counts activations per UTC day and per 10-minute window', async () => {
    const load = await report();
    expect(load).toMatchObject({ from: '2025-03-01T00:00:00.000Z', to: '2025-03-03T00:00:00.000Z', total: 50 });
    expect(load.perDay).toEqual([
      { day: '2025-03-01', count: 49 },
      { day: '2025-03-02', count: 1 },
    ]);
    const w = (hhmm: string, count: number, day = 1) => ({ start: `2025-03-0${day}T${hhmm}:00.000Z`, count });
    expect(load.per10Min).toEqual([
      w('00:00', 1),
      w('01:00', 1),
      w('03:00', 1),
      w('08:00', 12),
      w('08:10', 11),
      w('08:30', 10),
      w('09:00', 11),
      w('10:00', 1),
      w('20:00', 1),
      w('12:00', 1, 2),
    ]);
    expect(load.windowCount).toBe(288);
    expect(load.windowsOverTargetPercent).toBeCloseTo((100 * 4) / 288, 10);
  });

  it('merges back-to-back flood windows', async () => {
    expect((await report()).floods).toEqual([
      { start: '2025-03-01T08:00:00.000Z', end: '2025-03-01T08:20:00.000Z', count: 23 },
      { start: '2025-03-01T09:00:00.000Z', end: '2025-03-01T09:10:00.000Z', count: 11 },
    ]);
  });

  it('finds chattering alerts, a repeat just after the period began included', async () => {
    expect((await report()).chattering).toEqual([
      { alertId: alertIds.C, loopTag: loops.L2.tag, rule: 'band', repeats: 2 },
      { alertId: alertIds.E, loopTag: loops.L3.tag, rule: 'nis', repeats: 1 },
    ]);
  });

  it('lists alerts active for more than a day at the end of the period', async () => {
    const load = await report();
    expect(load.staleAsOf).toBe('2025-03-03T00:00:00.000Z');
    expect(load.stale).toEqual([
      { alertId: alertIds.S, loopTag: loops.L4.tag, rule: 'stale', raisedAt: '2025-03-01T10:00:00.000Z', hours: 38 },
      { alertId: alertIds.S4, loopTag: loops.L4.tag, rule: 'nis', raisedAt: '2025-03-01T20:00:00.000Z', hours: 28 },
    ]);
  });

  it('ranks the loops that raise most and takes the mean time to acknowledge', async () => {
    const load = await report();
    expect(load.topLoops.map((l) => [l.loopTag, l.count])).toEqual([
      [loops.L3.tag, 12],
      [loops.L5.tag, 11],
      [loops.L6.tag, 10],
      [loops.L1.tag, 8],
      [loops.L2.tag, 5],
      [loops.L4.tag, 4],
    ]);
    expect(load.topLoops[0]).toEqual({
      loopId: loops.L3.id,
      loopTag: loops.L3.tag,
      loopName: 'Load test L3',
      count: 12,
    });
    expect(load.meanTimeToAcknowledgeS).toBeCloseTo(804, 6);
    expect(load.acknowledgedAlerts).toBe(5);
  });

  it('counts only what falls inside a shorter period, days cut short and empty days included', async () => {
    const load = await report('from=2025-03-01T12:00:00Z&to=2025-03-02T12:00:00Z');
    expect(load.perDay).toEqual([
      { day: '2025-03-01', count: 1 },
      { day: '2025-03-02', count: 0 },
    ]);
    expect(load).toMatchObject({
      total: 1,
      windowCount: 144,
      floods: [],
      chattering: [],
      meanTimeToAcknowledgeS: null,
    });
    // at noon on 2 March S has been active 26 h, S4 16 h
    expect(load.stale.map((s) => [s.alertId, s.hours])).toEqual([[alertIds.S, 26]]);
  });

  it('defaults to the last seven days and refuses a reversed or too long period', async () => {
    const load = await report('');
    expect(Date.parse(load.to) - Date.parse(load.from)).toBe(7 * 86_400_000);
    expect(Math.abs(Date.parse(load.to) - Date.now())).toBeLessThan(60_000);
    for (const query of [
      'from=2025-03-03T00:00:00Z&to=2025-03-01T00:00:00Z',
      'from=2024-01-01T00:00:00Z&to=2025-03-01T00:00:00Z',
      'from=yesterday',
    ]) {
      const response = await operator.request<ErrorResponse<{ path: string }[]>>('GET', `/api/v1/alerts/load?${query}`);
      expect(response.status, query).toBe(400);
      expect(response.body.error.details[0].path).toBe('query.from');
    }
  });

  it('downloads the same figures as CSV, one block per table', async () => {
    const response = await operator.raw(`${api.url}/api/v1/alerts/load.csv?${PERIOD}`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(response.headers.get('content-disposition')).toMatch(
      /^attachment; filename="?alert-load-20250301T0000Z-20250303T0000Z\.csv"?$/,
    );
    const blocks = (await response.text())
      .trimEnd()
      .split('\r\n\r\n')
      .map((block) => Papa.parse<string[]>(block).data);
    const section = (name: string) => blocks.find((b) => b[1]?.[0] === name);
    expect(section('summary')).toEqual(expect.arrayContaining([['summary', 'activations', '50']]));
    expect(section('summary')).toEqual(expect.arrayContaining([['summary', 'mean time to acknowledge (s)', '804']]));
    expect(section('per day')).toEqual([
      ['section', 'day (UTC)', 'activations'],
      ['per day', '2025-03-01', '49'],
      ['per day', '2025-03-02', '1'],
    ]);
    expect(section('floods')).toEqual([
      ['section', 'start', 'end', 'activations'],
      ['floods', '2025-03-01T08:00:00.000Z', '2025-03-01T08:20:00.000Z', '23'],
      ['floods', '2025-03-01T09:00:00.000Z', '2025-03-01T09:10:00.000Z', '11'],
    ]);
    expect(section('chattering')?.slice(1)).toEqual([
      ['chattering', alertIds.C, loops.L2.tag, 'band', '2'],
      ['chattering', alertIds.E, loops.L3.tag, 'nis', '1'],
    ]);
    const column = (name: string, index: number) =>
      section(name)
        ?.slice(1)
        .map((row) => row[index]);
    expect(column('stale', 5)).toEqual(['38', '28']);
    expect(column('top loops', 4)).toEqual(['12', '11', '10', '8', '5', '4']);
  });
});
