import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { discretizeZoh, type Matrix } from '@shadowloop/simulator/engine';
import { migrateAndSeed } from '../../ops/lib/database.js';

const stack = inject('stack');
let db: Knex;
const DEMO_TAGS = ['AER-DO-101', 'DIG-TT-301', 'DIS-CL-401', 'STO-LT-201'];

beforeAll(() => {
  db = knexFactory({ client: 'pg', connection: stack.databaseUrl, pool: { min: 0, max: 2 } });
});
afterAll(async () => {
  await db.destroy();
});

const count = async (table: string) => Number((await db(table).count<{ count: string }[]>('* as count'))[0].count);

type Row = {
  tag: string;
  status: string;
  a: Matrix;
  b: Matrix;
  continuous: { Ac: Matrix; Bc: Matrix; samplePeriodS: number };
  author: string;
  reviewer: string | null;
  activator: string | null;
};

describe('the registry demo seed', () => {
  it('changes nothing when it runs a second time', async () => {
    const before = await Promise.all(['areas', 'loops', 'model_versions'].map(count));
    await migrateAndSeed(stack.databaseUrl, { seed: true });
    expect(await Promise.all(['areas', 'loops', 'model_versions'].map(count))).toEqual(before);
  });

  it('gives each demo loop one active version (engineer wrote it, reviewer approved and activated it) and one version awaiting review', async () => {
    const rows = (await db('model_versions as v')
      .join('loops as l', 'l.id', 'v.loop_id')
      .join('users as au', 'au.id', 'v.author_id')
      .leftJoin('users as rv', 'rv.id', 'v.reviewer_id')
      .leftJoin('users as ac', 'ac.id', 'v.activated_by')
      .whereIn('l.tag', DEMO_TAGS)
      .select(
        'l.tag',
        'v.status',
        'v.a',
        'v.b',
        'v.continuous',
        'au.email as author',
        'rv.email as reviewer',
        'ac.email as activator',
      )) as Row[];
    const active = rows.filter((r) => r.status === 'active');
    expect(active.map((r) => r.tag).sort()).toEqual(DEMO_TAGS);
    for (const row of active)
      expect(row).toMatchObject({
        author: 'engineer@quillmere.example',
        reviewer: 'reviewer@quillmere.example',
        activator: 'reviewer@quillmere.example',
      });
    expect(rows.filter((r) => r.status === 'in_review').map((r) => r.tag)).toEqual(['AER-DO-101']);
    for (const row of rows) {
      const { A, B } = discretizeZoh(row.continuous.Ac, row.continuous.Bc, row.continuous.samplePeriodS);
      expect([row.a, row.b]).toEqual([A, B]);
    }
  });
});
