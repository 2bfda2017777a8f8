import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { AlertSettings, OnCallNow, RotaPerson, Shift } from '../../api/src/contracts/alerts.js';
import { migrateAndSeed } from '../../ops/lib/database.js';
import { startApi, type RunningApi } from '../helpers/api-server.js';
import { ENGINEER, ONCALL, OPERATOR, REVIEWER, signedIn, type ErrorResponse } from '../helpers/registry-fixtures.js';
import type { SessionClient } from '../helpers/session-client.js';
import { openDb } from '../helpers/twin-fixtures.js';

const stack = inject('stack');
const ADMIN = 'admin@quillmere.example';
let api: RunningApi;
let db: Knex;
let admin: SessionClient;
let oncall: SessionClient;
let operator: SessionClient;
let engineer: SessionClient;
const ids: Record<string, string> = {};
/** Areas of this file only, so its shifts never change who other suites reach. */
let area: string;
let quietArea: string;

const HOUR = 3_600_000;
/** A fixed week far from now and from the demo rota. */
const at = (day: number, hour: number) => new Date(Date.UTC(2030, 0, 7 + day, hour)).toISOString();
const shiftBody = (overrides: Record<string, unknown> = {}) => ({
  userId: ids[ONCALL],
  area,
  position: 'primary',
  startsAt: at(0, 8),
  endsAt: at(0, 20),
  note: 'day cover',
  ...overrides,
});

async function newArea(): Promise<string> {
  const id = `rota-test-${randomBytes(4).toString('hex')}`;
  await db('areas').insert({ id, name: `Rota test ${id}`, sort_order: 99 });
  return id;
}

const post = (client: SessionClient, body: unknown) =>
  client.request<Shift & ErrorResponse<{ clashingShift: Shift }>>('POST', '/api/v1/oncall/shifts', body, {
    csrf: true,
  });

async function created(body: Record<string, unknown>): Promise<Shift> {
  const response = await post(oncall, shiftBody(body));
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body;
}

const auditOf = (action: string, targetId: string) =>
  db('audit_log').where({ action, target_id: targetId }).orderBy('id');

beforeAll(async () => {
  api = await startApi(stack);
  db = openDb(stack.databaseUrl);
  [admin, oncall, operator, engineer] = await Promise.all(
    [ADMIN, ONCALL, OPERATOR, ENGINEER].map((email) => signedIn(api.url, email)),
  );
  for (const email of [ADMIN, ONCALL, OPERATOR, ENGINEER, REVIEWER])
    ids[email] = (await db('users').where({ email }).first('id')).id;
  [area, quietArea] = [await newArea(), await newArea()];
});
afterAll(async () => {
  await db.destroy();
  await api.close();
});

describe('the people who may take shifts', () => {
  it('lists holders of the oncall or admin role to anyone signed in', async () => {
    const response = await operator.request<RotaPerson[]>('GET', '/api/v1/oncall/people');
    expect(response.status).toBe(200);
    const emails = response.body.map((p) => p.email);
    expect(emails).toEqual(expect.arrayContaining([ONCALL, ADMIN]));
    expect(emails).not.toContain(OPERATOR);
    expect(emails).not.toContain(ENGINEER);
    expect(response.body.find((p) => p.email === ONCALL)).toEqual({
      id: ids[ONCALL],
      name: 'Dara Okafor',
      email: ONCALL,
      roles: ['oncall'],
    });
  });
});

describe('shifts', () => {
  it('adds, lists, edits and removes a shift, auditing each change', async () => {
    const shift = await created({});
    expect(shift).toMatchObject({
      user: { id: ids[ONCALL], name: 'Dara Okafor', email: ONCALL },
      area,
      position: 'primary',
      startsAt: '2030-01-07T08:00:00.000Z',
      endsAt: '2030-01-07T20:00:00.000Z',
      note: 'day cover',
    });
    const listed = await operator.request<Shift[]>('GET', `/api/v1/oncall/shifts?from=${at(0, 0)}&to=${at(1, 0)}`);
    expect(listed.status).toBe(200);
    expect(listed.body.find((s) => s.id === shift.id)).toEqual(shift);
    const later = await operator.request<Shift[]>('GET', `/api/v1/oncall/shifts?from=${at(0, 20)}&to=${at(1, 0)}`);
    expect(later.body.map((s) => s.id)).not.toContain(shift.id);

    const edited = await oncall.request<Shift>(
      'PUT',
      `/api/v1/oncall/shifts/${shift.id}`,
      shiftBody({ userId: ids[ADMIN], endsAt: at(0, 22), note: 'longer' }),
      { csrf: true },
    );
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ user: { email: ADMIN }, endsAt: '2030-01-07T22:00:00.000Z', note: 'longer' });
    const [update] = await auditOf('oncall_shift.updated', shift.id);
    expect(update.actor_email).toBe(ONCALL);
    expect(update.details.before).toMatchObject({ user: { email: ONCALL }, endsAt: shift.endsAt });
    expect(update.details.after).toMatchObject({ user: { email: ADMIN }, note: 'longer' });

    const removed = await admin.request('DELETE', `/api/v1/oncall/shifts/${shift.id}`, undefined, { csrf: true });
    expect(removed.status).toBe(204);
    const after = await operator.request<Shift[]>('GET', `/api/v1/oncall/shifts?from=${at(0, 0)}&to=${at(1, 0)}`);
    expect(after.body.map((s) => s.id)).not.toContain(shift.id);
    expect(await auditOf('oncall_shift.created', shift.id)).toHaveLength(1);
    expect((await auditOf('oncall_shift.deleted', shift.id))[0].details.before.id).toBe(shift.id);
    const gone = await oncall.request('DELETE', `/api/v1/oncall/shifts/${shift.id}`, undefined, { csrf: true });
    expect(gone.status).toBe(404);
  });

  it('refuses an overlapping shift of the same position and area with 409 naming the other shift', async () => {
    const first = await created({ startsAt: at(1, 8), endsAt: at(1, 20) });
    const clash = await post(oncall, shiftBody({ userId: ids[ADMIN], startsAt: at(1, 19), endsAt: at(1, 23) }));
    expect(clash.status).toBe(409);
    expect(clash.body.error.message).toContain('Dara Okafor');
    expect(clash.body.error.message).toContain('2030-01-08T08:00:00.000Z');
    expect(clash.body.error.message).toContain('2030-01-08T20:00:00.000Z');
    expect(clash.body.error.details.clashingShift.id).toBe(first.id);

    // another position, another area, plant-wide far from the demo rota, or back to back: all fine
    await created({ position: 'secondary', startsAt: at(1, 19), endsAt: at(1, 23) });
    await created({ area: quietArea, startsAt: at(1, 19), endsAt: at(1, 23) });
    await created({ area: null, startsAt: at(1, 19), endsAt: at(1, 23) });
    const next = await created({ startsAt: at(1, 20), endsAt: at(2, 8) });

    const stretched = await oncall.request<ErrorResponse<{ clashingShift: Shift }>>(
      'PUT',
      `/api/v1/oncall/shifts/${first.id}`,
      shiftBody({ startsAt: at(1, 8), endsAt: at(1, 21) }),
      { csrf: true },
    );
    expect(stretched.status).toBe(409);
    expect(stretched.body.error.details.clashingShift.id).toBe(next.id);
    const unchanged = await oncall.request(
      'PUT',
      `/api/v1/oncall/shifts/${first.id}`,
      shiftBody({ startsAt: at(1, 8), endsAt: at(1, 20), note: 'same times' }),
      {
        csrf: true,
      },
    );
    expect(unchanged.status).toBe(200);
  });

  it('refuses a plant-wide shift over the demo rota, naming the demo primary', async () => {
    const now = Date.now();
    const clash = await post(
      admin,
      shiftBody({
        area: null,
        startsAt: new Date(now + HOUR).toISOString(),
        endsAt: new Date(now + 2 * HOUR).toISOString(),
      }),
    );
    expect(clash.status).toBe(409);
    expect(clash.body.error.message).toContain('Dara Okafor (oncall@quillmere.example) is primary on call plant-wide');
  });

  it('lets only one of several simultaneous overlapping shifts in', async () => {
    const attempts = await Promise.all(
      [0, 1, 2, 3, 4].map((i) => post(oncall, shiftBody({ startsAt: at(3, 8 + i), endsAt: at(3, 18 + i) }))),
    );
    expect(attempts.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409]);
    const listed = await oncall.request<Shift[]>('GET', `/api/v1/oncall/shifts?from=${at(3, 0)}&to=${at(4, 0)}`);
    expect(listed.body.filter((s) => s.area === area && s.position === 'primary')).toHaveLength(1);
  });

  it('checks the person, the area and the times, naming the field', async () => {
    const cases: [Record<string, unknown>, number, string][] = [
      [{ userId: ids[ENGINEER] }, 422, 'body.userId'],
      [{ userId: '00000000-0000-4000-8000-000000000000' }, 400, 'body.userId'],
      [{ area: 'no-such-area' }, 400, 'body.area'],
      [{ startsAt: at(4, 10), endsAt: at(4, 9) }, 400, 'body.endsAt'],
      [{ startsAt: at(4, 10), endsAt: at(40, 10) }, 400, 'body.endsAt'],
      [{ position: 'tertiary' }, 400, 'body.position'],
    ];
    for (const [overrides, status, path] of cases) {
      const response = await post(admin, shiftBody({ startsAt: at(4, 8), endsAt: at(4, 9), ...overrides }));
      expect(response.status, JSON.stringify(overrides)).toBe(status);
      expect(response.body.error.details).toEqual(expect.arrayContaining([expect.objectContaining({ path })]));
    }
    const range = await operator.request<ErrorResponse>('GET', `/api/v1/oncall/shifts?from=${at(2, 0)}&to=${at(1, 0)}`);
    expect(range.status).toBe(400);
  });

  it('lets administrators and on-call engineers change the rota, and nobody else', async () => {
    expect((await post(operator, shiftBody({ startsAt: at(5, 8) }))).status).toBe(403);
    expect((await post(engineer, shiftBody({ startsAt: at(5, 8) }))).status).toBe(403);
    const byAdmin = await post(admin, shiftBody({ startsAt: at(5, 8), endsAt: at(5, 9) }));
    expect(byAdmin.status).toBe(201);
    const swap = await operator.request(
      'POST',
      `/api/v1/oncall/shifts/${byAdmin.body.id}/swap`,
      { withShiftId: byAdmin.body.id },
      { csrf: true },
    );
    expect(swap.status).toBe(403);
    expect(
      (await operator.request('DELETE', `/api/v1/oncall/shifts/${byAdmin.body.id}`, undefined, { csrf: true })).status,
    ).toBe(403);
  });

  it('swaps the people of two shifts at once, audited', async () => {
    const mine = await created({ startsAt: at(6, 8), endsAt: at(6, 20) });
    const theirs = await created({ userId: ids[ADMIN], position: 'secondary', startsAt: at(7, 8), endsAt: at(7, 20) });
    const response = await oncall.request<Shift[]>(
      'POST',
      `/api/v1/oncall/shifts/${mine.id}/swap`,
      { withShiftId: theirs.id },
      { csrf: true },
    );
    expect(response.status).toBe(200);
    expect(response.body).toEqual([
      { ...mine, user: theirs.user },
      { ...theirs, user: mine.user },
    ]);
    const [audit] = await auditOf('oncall_shift.swapped', mine.id);
    expect(audit.details).toEqual({ shifts: [mine.id, theirs.id], before: { [mine.id]: ONCALL, [theirs.id]: ADMIN } });

    const self = await oncall.request(
      'POST',
      `/api/v1/oncall/shifts/${mine.id}/swap`,
      { withShiftId: mine.id },
      { csrf: true },
    );
    expect(self.status).toBe(400);
    const unknown = await oncall.request(
      'POST',
      `/api/v1/oncall/shifts/${mine.id}/swap`,
      { withShiftId: '00000000-0000-4000-8000-000000000000' },
      { csrf: true },
    );
    expect(unknown.status).toBe(404);
  });
});

describe('who is on call now', () => {
  it("takes an area's own shift over the plant-wide one, position by position", async () => {
    const now = Date.now();
    const around = { startsAt: new Date(now - HOUR).toISOString(), endsAt: new Date(now + HOUR).toISOString() };
    await created({ userId: ids[ADMIN], ...around });
    await created({ position: 'secondary', ...around });
    const response = await operator.request<OnCallNow>('GET', '/api/v1/oncall/now');
    expect(response.status).toBe(200);
    const person = (email: string, name: string) => ({ id: ids[email], email, name });
    const [dara, ruth] = [person(ONCALL, 'Dara Okafor'), person(ADMIN, 'Ruth Ellery')];
    // the demo rota: Dara primary, Ruth secondary, plant-wide
    expect(response.body).toMatchObject({ primary: dara, secondary: ruth });
    expect(response.body.areas.find((a) => a.area === area)).toEqual({ area, primary: ruth, secondary: dara });
    expect(response.body.areas.find((a) => a.area === quietArea)).toEqual({
      area: quietArea,
      primary: dara,
      secondary: ruth,
    });
    expect(Math.abs(Date.parse(response.body.at) - now)).toBeLessThan(60_000);

    const later = await operator.request<OnCallNow>(
      'GET',
      `/api/v1/oncall/now?at=${new Date(now + 2 * HOUR).toISOString()}`,
    );
    expect(later.body.areas.find((a) => a.area === area)).toEqual({ area, primary: dara, secondary: ruth });
  });
});

describe('the demo rota', () => {
  it('keeps someone on call for two weeks ahead in daily shifts, and a second run adds nothing', async () => {
    const count = async () => Number((await db('oncall_shifts').count<{ count: string }[]>('* as count'))[0].count);
    const demo = (await db('oncall_shifts as s')
      .join('users as u', 'u.id', 's.user_id')
      .whereNull('s.area_id')
      .andWhere('s.note', 'Demo rota')
      .select('u.email', 's.position', 's.starts_at', 's.ends_at')) as {
      email: string;
      position: string;
      starts_at: Date;
      ends_at: Date;
    }[];
    for (const row of demo) {
      expect(row.ends_at.getTime() - row.starts_at.getTime()).toBe(24 * HOUR);
      expect(row.starts_at.getUTCHours()).toBe(6);
      expect(row.email).toBe(row.position === 'primary' ? ONCALL : ADMIN);
    }
    const horizon = Date.now() + 13 * 24 * HOUR;
    for (const position of ['primary', 'secondary'])
      expect(demo.some((r) => r.position === position && r.ends_at.getTime() > horizon)).toBe(true);

    const before = await count();
    await migrateAndSeed(stack.databaseUrl, { seed: true });
    expect(await count()).toBe(before);
  });

  it('does not bring back a demo shift someone deleted', async () => {
    const far = (await db('oncall_shifts')
      .whereNull('area_id')
      .andWhere({ position: 'secondary', note: 'Demo rota' })
      .orderBy('starts_at', 'desc')
      .first('id', 'starts_at')) as { id: string; starts_at: Date };
    const removed = await admin.request('DELETE', `/api/v1/oncall/shifts/${far.id}`, undefined, { csrf: true });
    expect(removed.status).toBe(204);
    await migrateAndSeed(stack.databaseUrl, { seed: true });
    const refilled = await db('oncall_shifts')
      .whereNull('area_id')
      .andWhere({ position: 'secondary', starts_at: far.starts_at })
      .first('id');
    expect(refilled).toBeUndefined();
  });
});

describe('area engineers', () => {
  it("lists each area's engineers, the demo ones included", async () => {
    const response = await operator.request<{ area: string; engineers: { email: string }[] }[]>(
      'GET',
      '/api/v1/oncall/area-engineers',
    );
    expect(response.status).toBe(200);
    const of = (id: string) => response.body.find((a) => a.area === id)?.engineers.map((e) => e.email);
    expect(of('aeration')).toEqual([ENGINEER]);
    expect(of('storage')).toEqual([ENGINEER]);
    expect(of('digestion')).toEqual([REVIEWER]);
    expect(of('disinfection')).toEqual([REVIEWER]);
    expect(of(area)).toEqual([]);
  });

  it('lets an administrator set them, engineers only, audited', async () => {
    const path = `/api/v1/oncall/area-engineers/${area}`;
    const set = await admin.request<{ area: string; engineers: { email: string }[] }>(
      'PUT',
      path,
      { userIds: [ids[REVIEWER], ids[ENGINEER], ids[ENGINEER]] },
      { csrf: true },
    );
    expect(set.status).toBe(200);
    expect(set.body.engineers.map((e) => e.email).sort()).toEqual([ENGINEER, REVIEWER]);
    const [audit] = await auditOf('area_engineers.changed', area);
    expect(audit.details).toEqual({ before: [], after: [ids[REVIEWER], ids[ENGINEER]] });

    const notEngineer = await admin.request<ErrorResponse<{ path: string }[]>>(
      'PUT',
      path,
      { userIds: [ids[ONCALL]] },
      { csrf: true },
    );
    expect(notEngineer.status).toBe(422);
    expect(notEngineer.body.error.message).toContain('Dara Okafor');
    expect(notEngineer.body.error.details[0].path).toBe('body.userIds');
    expect(
      (await admin.request('PUT', '/api/v1/oncall/area-engineers/no-such-area', { userIds: [] }, { csrf: true }))
        .status,
    ).toBe(404);
    expect((await oncall.request('PUT', path, { userIds: [] }, { csrf: true })).status).toBe(403);

    const cleared = await admin.request<{ engineers: unknown[] }>('PUT', path, { userIds: [] }, { csrf: true });
    expect(cleared.body.engineers).toEqual([]);
  });
});

describe('alert settings', () => {
  it('refuses an area step that does not come after the secondary, naming the field, before the database sees it', async () => {
    const current = (await operator.request<AlertSettings>('GET', '/api/v1/alert-settings')).body;
    const response = await admin.request<ErrorResponse<{ path: string; message: string }[]>>(
      'PUT',
      '/api/v1/alert-settings',
      { ...current, secondaryAfterMin: 30, areaAfterMin: 30 },
      { csrf: true },
    );
    expect(response.status).toBe(400);
    expect(response.body.error.details[0]).toMatchObject({ path: 'body.areaAfterMin' });
    expect(response.body.error.details[0].message).toContain('secondaryAfterMin');
    const missing = await admin.request('PUT', '/api/v1/alert-settings', { secondaryAfterMin: 5 }, { csrf: true });
    expect(missing.status).toBe(400);
    expect((await operator.request<AlertSettings>('GET', '/api/v1/alert-settings')).body).toEqual(current);
  });

  it('lets an administrator change them, audited, and nobody else', async () => {
    const current = (await operator.request<AlertSettings>('GET', '/api/v1/alert-settings')).body;
    const next = { ...current, targetPerDay: current.targetPerDay + 1 };
    expect((await oncall.request('PUT', '/api/v1/alert-settings', next, { csrf: true })).status).toBe(403);
    try {
      const saved = await admin.request<AlertSettings>('PUT', '/api/v1/alert-settings', next, { csrf: true });
      expect(saved.status).toBe(200);
      expect(saved.body).toEqual(next);
      const audit = await db('audit_log').where({ action: 'alert_settings.changed' }).orderBy('id', 'desc').first();
      expect(audit.details).toEqual({ before: current, after: next });
    } finally {
      await admin.request('PUT', '/api/v1/alert-settings', current, { csrf: true });
    }
  });
});
