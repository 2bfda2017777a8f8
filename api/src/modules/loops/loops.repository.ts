import type { Knex } from 'knex';
import type { Loop, Signal } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import { conflict } from '../../http/errors.js';
import { joinTracking, trackingFieldsOf, type TrackingColumns } from '../tracking/loop-tracking.js';

type OperatingPoint = Loop['operatingPoint'];

/** The stored fields of a loop, in API names. */
export interface LoopRecord {
  tag: string;
  name: string;
  area: string;
  description: string;
  samplePeriodS: number;
  inputs: Signal[];
  states: Signal[];
  outputs: Signal[];
  operatingPoint: OperatingPoint;
  timeZone: string;
}

type Raw = {
  id: string;
  tag: string;
  name: string;
  area_id: string;
  area_name: string;
  description: string;
  sample_period_s: number;
  inputs: Signal[];
  states: Signal[];
  outputs: Signal[];
  operating_point: OperatingPoint;
  time_zone: string;
  maintenance: boolean;
  created_at: Date;
  updated_at: Date;
  active_version_id: string | null;
  active_version_number: number | null;
  draft_count: number;
  in_review_count: number;
} & TrackingColumns;

const countOf = (status: string) =>
  `(SELECT count(*) FROM model_versions v WHERE v.loop_id = l.id AND v.status = '${status}')::int`;

function selectLoops(db: Db) {
  return joinTracking(
    db,
    db('loops as l')
      .join('areas as a', 'a.id', 'l.area_id')
      .leftJoin('model_versions as av', (join) => join.on('av.loop_id', 'l.id').andOnVal('av.status', 'active'))
      .select(
        'l.*',
        'a.name as area_name',
        'av.id as active_version_id',
        'av.number as active_version_number',
        db.raw(`${countOf('draft')} as draft_count`),
        db.raw(`${countOf('in_review')} as in_review_count`),
      ),
  );
}

const toLoop = (r: Raw): Loop => ({
  id: r.id,
  tag: r.tag,
  name: r.name,
  area: r.area_id,
  areaName: r.area_name,
  description: r.description,
  samplePeriodS: r.sample_period_s,
  inputs: r.inputs,
  states: r.states,
  outputs: r.outputs,
  operatingPoint: r.operating_point,
  timeZone: r.time_zone,
  ...trackingFieldsOf(r),
  activeVersionId: r.active_version_id,
  maintenance: r.maintenance,
  activeVersionNumber: r.active_version_number,
  draftCount: r.draft_count,
  inReviewCount: r.in_review_count,
  createdAt: r.created_at.toISOString(),
  updatedAt: r.updated_at.toISOString(),
});

export async function listLoopRows(db: Db, filter: { area?: string }): Promise<Loop[]> {
  const rows = (await selectLoops(db)
    .modify((q) => {
      if (filter.area) q.where('l.area_id', filter.area);
    })
    .orderBy([{ column: 'a.sort_order' }, { column: 'l.tag' }])) as Raw[];
  return rows.map(toLoop);
}

export async function findLoop(db: Db, id: string): Promise<Loop | undefined> {
  const row = (await selectLoops(db).where('l.id', id).first()) as Raw | undefined;
  return row && toLoop(row);
}

/** Locks the loop row until the transaction ends: activations and edits of one loop queue here. */
export async function lockLoop(trx: Knex.Transaction, id: string): Promise<{ id: string; tag: string } | undefined> {
  return trx('loops').where({ id }).forUpdate().first('id', 'tag');
}

export async function countVersions(db: Db, loopId: string): Promise<number> {
  const [{ count }] = await db('model_versions').where({ loop_id: loopId }).count<{ count: string }[]>('* as count');
  return Number(count);
}

/** A loop's API fields as columns of the loops table (undefined fields are left out of updates). */
export const loopColumns = (loop: Partial<LoopRecord>) => ({
  tag: loop.tag,
  name: loop.name,
  area_id: loop.area,
  description: loop.description,
  sample_period_s: loop.samplePeriodS,
  inputs: json(loop.inputs),
  states: json(loop.states),
  outputs: json(loop.outputs),
  operating_point: json(loop.operatingPoint),
  time_zone: loop.timeZone,
});
const json = (value: unknown) => (value === undefined ? undefined : JSON.stringify(value));

export async function insertLoop(trx: Db, loop: LoopRecord, createdBy: string): Promise<string> {
  const [row] = await trx('loops')
    .insert({ ...loopColumns(loop), created_by: createdBy })
    .returning<{ id: string }[]>('id')
    .catch(rethrowDuplicateTag(loop.tag));
  return row.id;
}

export async function updateLoopRow(trx: Db, id: string, loop: Partial<LoopRecord>): Promise<void> {
  await trx('loops')
    .where({ id })
    .update({ ...loopColumns(loop), updated_at: trx.fn.now() })
    .catch(rethrowDuplicateTag(loop.tag));
}

function rethrowDuplicateTag(tag: string | undefined) {
  return (error: { code?: string; constraint?: string }): never => {
    if (error.code === '23505' && error.constraint === 'loops_tag_unique')
      throw conflict(`A loop with tag ${tag} already exists.`);
    throw error;
  };
}
