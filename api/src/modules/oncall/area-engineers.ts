import type { z } from 'zod';
import type { SignedInUser } from '../../auth/user.js';
import type { AreaEngineersSchema, Person } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { notFound } from '../../http/errors.js';
import { areaExists } from '../areas/areas.repository.js';
import { recordAudit } from '../audit/audit.repository.js';
import { requirePeopleWithRole } from './rota-people.js';

type AreaEngineers = z.infer<typeof AreaEngineersSchema>;
type Raw = { area: string; engineers: Person[] };

/** Every area with its engineers (the last escalation step), in the areas' display order. */
export async function listAreaEngineers(db: Db, onlyArea?: string): Promise<AreaEngineers> {
  const rows = (await db('areas as a')
    .modify((q) => {
      if (onlyArea !== undefined) q.where('a.id', onlyArea);
    })
    .orderBy([{ column: 'a.sort_order' }, { column: 'a.name' }])
    .select(
      'a.id as area',
      db.raw(`coalesce((
        SELECT json_agg(json_build_object('id', u.id, 'name', u.name, 'email', u.email) ORDER BY u.name)
        FROM area_engineers ae JOIN users u ON u.id = ae.user_id WHERE ae.area_id = a.id), '[]'::json) AS engineers`),
    )) as Raw[];
  return rows;
}

/** The people an alert in `area` escalates to after the secondary. */
export async function findAreaEngineers(db: Db, area: string): Promise<Person[]> {
  return (await listAreaEngineers(db, area))[0]?.engineers ?? [];
}

/** Replaces an area's engineers; each must hold the engineer role. */
export async function setAreaEngineers(db: Db, actor: SignedInUser, area: string, userIds: string[]) {
  if (!(await areaExists(db, area))) throw notFound(`Area "${area}"`);
  const ids = [...new Set(userIds)];
  await db.transaction(async (trx) => {
    // Two edits of one area queue here (the area row, without blocking loops that reference it).
    await trx.raw('SELECT id FROM areas WHERE id = ? FOR NO KEY UPDATE', [area]);
    await requirePeopleWithRole(trx, ids, ['engineer'], 'body.userIds');
    const before = (await trx('area_engineers').where({ area_id: area }).pluck('user_id')) as string[];
    await trx('area_engineers').where({ area_id: area }).delete();
    if (ids.length) await trx('area_engineers').insert(ids.map((user_id) => ({ area_id: area, user_id })));
    await recordAudit(trx, {
      actor,
      action: 'area_engineers.changed',
      targetType: 'area',
      targetId: area,
      details: { before, after: ids },
    });
  });
  return (await listAreaEngineers(db, area))[0];
}
