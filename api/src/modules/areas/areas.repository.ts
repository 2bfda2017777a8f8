import type { Db } from '../../db/knex.js';

export async function listAreas(db: Db): Promise<{ id: string; name: string }[]> {
  return db('areas')
    .select('id', 'name')
    .orderBy([{ column: 'sort_order' }, { column: 'name' }]);
}

export async function areaExists(db: Db, id: string): Promise<boolean> {
  return Boolean(await db('areas').where({ id }).first('id'));
}
