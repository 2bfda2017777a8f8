import type { OnCallNow, Person } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';

export interface OnCallPair {
  primary: Person | null;
  secondary: Person | null;
}

type Raw = {
  position: 'primary' | 'secondary';
  area_id: string | null;
  id: string;
  name: string;
  email: string;
  holds_oncall_role: boolean;
};

/** A person on the rota, and whether they hold the on-call role (so they may acknowledge). */
export type OnCallPerson = Person & { holdsOnCallRole: boolean };

/**
 * Who is on call for an area at one time, in one query: the area's own shift for each position
 * wins over a plant-wide one; among several covering shifts of one kind, the one that started last.
 */
export async function findOnCallPeople(
  db: Db,
  areaId: string | null,
  at: Date = new Date(),
): Promise<{ primary: OnCallPerson | null; secondary: OnCallPerson | null }> {
  const rows = (await db('oncall_shifts as s')
    .join('users as u', 'u.id', 's.user_id')
    .where('s.starts_at', '<=', at)
    .andWhere('s.ends_at', '>', at)
    .andWhere((q) => {
      q.whereNull('s.area_id');
      if (areaId !== null) q.orWhere('s.area_id', areaId);
    })
    .orderBy('s.starts_at', 'desc')
    .select(
      's.position',
      's.area_id',
      'u.id',
      'u.name',
      'u.email',
      db.raw(`EXISTS (SELECT 1 FROM user_roles r WHERE r.user_id = u.id AND r.role = 'oncall') AS holds_oncall_role`),
    )) as Raw[];
  const pick = (position: Raw['position']): OnCallPerson | null => {
    const own = rows.find((r) => r.position === position && r.area_id !== null);
    const wide = rows.find((r) => r.position === position && r.area_id === null);
    const row = own ?? wide;
    return row ? { id: row.id, name: row.name, email: row.email, holdsOnCallRole: row.holds_oncall_role } : null;
  };
  return { primary: pick('primary'), secondary: pick('secondary') };
}

const personOf = (p: OnCallPerson | null): Person | null => p && { id: p.id, name: p.name, email: p.email };

/** {@link findOnCallPeople} without the role flag. */
export async function findOnCall(db: Db, areaId: string | null, at: Date = new Date()): Promise<OnCallPair> {
  const { primary, secondary } = await findOnCallPeople(db, areaId, at);
  return { primary: personOf(primary), secondary: personOf(secondary) };
}

/** Who is on call at one time, plant-wide and for each area (each area's own shifts win). */
export async function findOnCallEverywhere(db: Db, at: Date = new Date()): Promise<OnCallNow> {
  const areas = (await db('areas')
    .orderBy([{ column: 'sort_order' }, { column: 'name' }])
    .pluck('id')) as string[];
  const [plant, ...perArea] = await Promise.all([
    findOnCall(db, null, at),
    ...areas.map((area) => findOnCall(db, area, at)),
  ]);
  return {
    at: at.toISOString(),
    ...plant,
    areas: areas.map((area, i) => ({ area, ...perArea[i] })),
  };
}
