import type { z } from 'zod';
import type { SignedInUser } from '../../auth/user.js';
import type { SaveShiftBodySchema, Shift } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { badRequest, conflict, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { areaExists } from '../areas/areas.repository.js';
import { recordAudit } from '../audit/audit.repository.js';
import { requirePeopleWithRole, ROTA_ROLES } from './rota-people.js';
import {
  deleteShift,
  findClashingShift,
  findShiftRow,
  insertShift,
  listShiftRows,
  lockRota,
  setShiftUser,
  updateShift,
  type ShiftColumns,
} from './shifts.repository.js';

type SaveShiftBody = z.infer<typeof SaveShiftBodySchema>;

const DAY_MS = 86_400_000;
/** A longer shift is almost always a typing slip (a year for a day); split long cover into shifts. */
export const MAX_SHIFT_DAYS = 31;
export const MAX_LIST_DAYS = 366;

const where = (area: string | null) => (area === null ? 'plant-wide' : `for area ${area}`);
export const describeShift = (s: Shift) =>
  `${s.user.name} (${s.user.email}) is ${s.position} on call ${where(s.area)} from ${s.startsAt} to ${s.endsAt}`;

export async function listShifts(db: Db, range: { from: string; to: string }): Promise<Shift[]> {
  const span = Date.parse(range.to) - Date.parse(range.from);
  if (span <= 0)
    throw badRequest('query.to must be after query.from.', [{ path: 'query.to', message: 'must be after from' }]);
  if (span > MAX_LIST_DAYS * DAY_MS)
    throw badRequest(`Ask for at most ${MAX_LIST_DAYS} days of shifts at a time.`, [
      { path: 'query.to', message: `at most ${MAX_LIST_DAYS} days after from` },
    ]);
  return listShiftRows(db, range.from, range.to);
}

async function requireShift(db: Db, id: string, label = 'Shift'): Promise<Shift> {
  const shift = isUuid(id) ? await findShiftRow(db, id) : undefined;
  if (!shift) throw notFound(`${label} ${id}`);
  return shift;
}

/** The rota's rules for one shift, checked under the rota lock: a rota person, a known area, no overlap. */
async function checkShift(trx: Db, body: SaveShiftBody, exceptId?: string): Promise<ShiftColumns> {
  if (Date.parse(body.endsAt) - Date.parse(body.startsAt) > MAX_SHIFT_DAYS * DAY_MS)
    throw badRequest(`A shift lasts at most ${MAX_SHIFT_DAYS} days; split longer cover into several shifts.`, [
      { path: 'body.endsAt', message: `at most ${MAX_SHIFT_DAYS} days after startsAt` },
    ]);
  if (body.area !== null && !(await areaExists(trx, body.area)))
    throw badRequest(`There is no area "${body.area}"; pick one from GET /api/v1/areas, or null for plant-wide.`, [
      { path: 'body.area', message: `unknown area ${body.area}` },
    ]);
  await requirePeopleWithRole(trx, [body.userId], ROTA_ROLES, 'body.userId');
  const columns: ShiftColumns = { ...body };
  const clash = await findClashingShift(trx, columns, exceptId);
  if (clash)
    throw conflict(`This overlaps another shift: ${describeShift(clash)} (shift ${clash.id}).`, {
      clashingShift: clash,
    });
  return columns;
}

export async function createShift(db: Db, actor: SignedInUser, body: SaveShiftBody): Promise<Shift> {
  const id = await db.transaction(async (trx) => {
    await lockRota(trx);
    const columns = await checkShift(trx, body);
    const shiftId = await insertShift(trx, columns, actor.id);
    const after = await requireShift(trx, shiftId);
    await recordAudit(trx, {
      actor,
      action: 'oncall_shift.created',
      targetType: 'oncall_shift',
      targetId: shiftId,
      details: { after },
    });
    return shiftId;
  });
  return requireShift(db, id);
}

/** Any rota holder may edit any shift: on-call engineers arrange cover among themselves. */
export async function replaceShift(db: Db, actor: SignedInUser, id: string, body: SaveShiftBody): Promise<Shift> {
  await requireShift(db, id);
  await db.transaction(async (trx) => {
    await lockRota(trx);
    const before = await requireShift(trx, id);
    await updateShift(trx, id, await checkShift(trx, body, id));
    const after = await requireShift(trx, id);
    await recordAudit(trx, {
      actor,
      action: 'oncall_shift.updated',
      targetType: 'oncall_shift',
      targetId: id,
      details: { before, after },
    });
  });
  return requireShift(db, id);
}

export async function removeShift(db: Db, actor: SignedInUser, id: string): Promise<void> {
  await requireShift(db, id);
  await db.transaction(async (trx) => {
    await lockRota(trx);
    const before = await requireShift(trx, id);
    await deleteShift(trx, id);
    await recordAudit(trx, {
      actor,
      action: 'oncall_shift.deleted',
      targetType: 'oncall_shift',
      targetId: id,
      details: { before },
    });
  });
}

/** The two shifts exchange their people in one transaction; times, areas and positions stay. */
export async function swapShifts(db: Db, actor: SignedInUser, id: string, withId: string): Promise<Shift[]> {
  if (id === withId)
    throw badRequest('A shift cannot be swapped with itself.', [{ path: 'body.withShiftId', message: 'same shift' }]);
  await Promise.all([requireShift(db, id), requireShift(db, withId, 'Shift to swap with')]);
  await db.transaction(async (trx) => {
    await lockRota(trx);
    const [a, b] = [await requireShift(trx, id), await requireShift(trx, withId, 'Shift to swap with')];
    if (a.user.id === b.user.id)
      throw badRequest(`Both shifts are already ${a.user.name}'s; there is nothing to swap.`, [
        { path: 'body.withShiftId', message: 'same person' },
      ]);
    await requirePeopleWithRole(trx, [a.user.id, b.user.id], ROTA_ROLES, 'shift.user');
    await setShiftUser(trx, a.id, b.user.id);
    await setShiftUser(trx, b.id, a.user.id);
    await recordAudit(trx, {
      actor,
      action: 'oncall_shift.swapped',
      targetType: 'oncall_shift',
      targetId: a.id,
      details: { shifts: [a.id, b.id], before: { [a.id]: a.user.email, [b.id]: b.user.email } },
    });
  });
  return [await requireShift(db, id), await requireShift(db, withId)];
}
