import type { Shift } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';

type Raw = {
  id: string;
  user_id: string;
  user_name: string;
  user_email: string;
  area_id: string | null;
  position: Shift['position'];
  starts_at: Date;
  ends_at: Date;
  note: string;
};

export interface ShiftColumns {
  userId: string;
  area: string | null;
  position: Shift['position'];
  startsAt: string;
  endsAt: string;
  note: string;
}

const toShift = (r: Raw): Shift => ({
  id: r.id,
  user: { id: r.user_id, name: r.user_name, email: r.user_email },
  area: r.area_id,
  position: r.position,
  startsAt: r.starts_at.toISOString(),
  endsAt: r.ends_at.toISOString(),
  note: r.note,
});

const selectShifts = (db: Db) =>
  db('oncall_shifts as s')
    .join('users as u', 'u.id', 's.user_id')
    .select('s.*', 'u.name as user_name', 'u.email as user_email');

const toRow = (c: ShiftColumns) => ({
  user_id: c.userId,
  area_id: c.area,
  position: c.position,
  starts_at: c.startsAt,
  ends_at: c.endsAt,
  note: c.note,
});

/** Shifts that overlap [from, to), earliest first. */
export async function listShiftRows(db: Db, from: string, to: string): Promise<Shift[]> {
  const rows = (await selectShifts(db)
    .where('s.starts_at', '<', to)
    .andWhere('s.ends_at', '>', from)
    .orderBy([{ column: 's.starts_at' }, { column: 's.position' }, { column: 's.area_id' }])) as Raw[];
  return rows.map(toShift);
}

export async function findShiftRow(db: Db, id: string): Promise<Shift | undefined> {
  const row = (await selectShifts(db).where('s.id', id).first()) as Raw | undefined;
  return row && toShift(row);
}

/**
 * The first shift of the same position and area (both plant-wide when area is null) whose time
 * overlaps [startsAt, endsAt); `exceptId` leaves out the shift being edited.
 */
export async function findClashingShift(db: Db, c: ShiftColumns, exceptId?: string): Promise<Shift | undefined> {
  const row = (await selectShifts(db)
    .where('s.position', c.position)
    .whereRaw('s.area_id IS NOT DISTINCT FROM ?', [c.area])
    .andWhere('s.starts_at', '<', c.endsAt)
    .andWhere('s.ends_at', '>', c.startsAt)
    .modify((q) => {
      if (exceptId) q.whereNot('s.id', exceptId);
    })
    .orderBy('s.starts_at')
    .first()) as Raw | undefined;
  return row && toShift(row);
}

/**
 * Serialises rota writers: this mode conflicts with itself (so two overlap checks cannot both
 * pass) but not with the plain reads of who is on call. Hold it for the rest of the transaction.
 */
export async function lockRota(trx: Db): Promise<void> {
  await trx.raw('LOCK TABLE oncall_shifts IN SHARE ROW EXCLUSIVE MODE');
}

export async function insertShift(db: Db, c: ShiftColumns, createdBy: string | null): Promise<string> {
  const [row] = await db('oncall_shifts')
    .insert({ ...toRow(c), created_by: createdBy })
    .returning<{ id: string }[]>('id');
  return row.id;
}

export async function updateShift(db: Db, id: string, c: ShiftColumns): Promise<void> {
  await db('oncall_shifts')
    .where({ id })
    .update({ ...toRow(c), updated_at: db.fn.now() });
}

export async function setShiftUser(db: Db, id: string, userId: string): Promise<void> {
  await db('oncall_shifts').where({ id }).update({ user_id: userId, updated_at: db.fn.now() });
}

export async function deleteShift(db: Db, id: string): Promise<void> {
  await db('oncall_shifts').where({ id }).delete();
}
