import type {
  Backtest,
  BacktestResults,
  BacktestStatus,
  BacktestSummary,
  BacktestUploadTallySchema,
} from '../../contracts/backtests.js';
import type { z } from 'zod';
import type { Db } from '../../db/knex.js';

export type UploadTally = z.infer<typeof BacktestUploadTallySchema>;

type Raw = {
  id: string;
  loop_id: string;
  loop_tag: string;
  status: BacktestStatus;
  progress: number;
  stage: string;
  source: 'range' | 'upload';
  range_from: Date | null;
  range_to: Date | null;
  upload: UploadTally | null;
  versions: Backtest['versions'];
  created_by: string | null;
  creator_name: string | null;
  created_at: Date;
  started_at: Date | null;
  finished_at: Date | null;
  cancel_requested: boolean;
  error: string | null;
  attached_to: Backtest['attachedTo'];
};

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** The backtest row with its loop's tag, its versions in the order asked for and where it is evidence. */
function selectBacktests(db: Db) {
  return db('backtests as b')
    .join('loops as l', 'l.id', 'b.loop_id')
    .leftJoin('users as u', 'u.id', 'b.created_by')
    .select(
      'b.id',
      'b.loop_id',
      'l.tag as loop_tag',
      'b.status',
      'b.progress',
      'b.stage',
      'b.source',
      'b.range_from',
      'b.range_to',
      'b.upload',
      'b.created_by',
      'u.name as creator_name',
      'b.created_at',
      'b.started_at',
      'b.finished_at',
      'b.cancel_requested',
      'b.error',
      db.raw(`(SELECT coalesce(json_agg(json_build_object('id', v.id, 'number', v.number, 'status', v.status, 'authorId', v.author_id)
        ORDER BY o.i), '[]') FROM unnest(b.version_ids) WITH ORDINALITY AS o(id, i)
        JOIN model_versions v ON v.id = o.id) AS versions`),
      db.raw(`(SELECT coalesce(json_agg(json_build_object('versionId', e.version_id, 'versionNumber', v.number)
        ORDER BY v.number), '[]') FROM model_version_evidence e JOIN model_versions v ON v.id = e.version_id
        WHERE e.backtest_id = b.id) AS attached_to`),
    );
}

const toSummaryFields = (r: Raw): Omit<Backtest, 'results'> => ({
  id: r.id,
  loopId: r.loop_id,
  loopTag: r.loop_tag,
  status: r.status,
  progress: r.progress,
  stage: r.stage,
  source: r.source,
  from: iso(r.range_from),
  to: iso(r.range_to),
  upload: r.upload,
  versions: r.versions,
  createdBy: r.created_by ? { id: r.created_by, name: r.creator_name ?? '' } : null,
  createdAt: r.created_at.toISOString(),
  startedAt: iso(r.started_at),
  finishedAt: iso(r.finished_at),
  cancelRequested: r.cancel_requested,
  error: r.error,
  attachedTo: r.attached_to,
});

export async function findBacktest(db: Db, id: string): Promise<Backtest | undefined> {
  const row = (await selectBacktests(db).select('b.results').where('b.id', id).first()) as
    (Raw & { results: BacktestResults | null }) | undefined;
  return row && { ...toSummaryFields(row), results: row.results };
}

/** Newest first, without results (the comparison's verdict only). */
export async function listLoopBacktests(db: Db, loopId: string, limit: number): Promise<BacktestSummary[]> {
  const rows = (await selectBacktests(db)
    .select(db.raw(`b.results->'comparison'->>'verdict' AS verdict`))
    .where('b.loop_id', loopId)
    .orderBy('b.created_at', 'desc')
    .orderBy('b.id')
    .limit(limit)) as (Raw & { verdict: string | null })[];
  return rows.map((r) => ({ ...toSummaryFields(r), verdict: r.verdict }));
}

export interface NewBacktest {
  loopId: string;
  versionIds: string[];
  createdBy: string;
  range?: { from: string; to: string };
  upload?: UploadTally;
}

/** Inserts a queued backtest; returns its id. */
export async function insertBacktest(db: Db, job: NewBacktest): Promise<string> {
  const [row] = await db('backtests')
    .insert({
      loop_id: job.loopId,
      version_ids: job.versionIds,
      source: job.upload ? 'upload' : 'range',
      range_from: job.range?.from ?? null,
      range_to: job.range?.to ?? null,
      upload: job.upload ? JSON.stringify(job.upload) : null,
      created_by: job.createdBy,
    })
    .returning<{ id: string }[]>('id');
  return row.id;
}

/**
 * Cancel: a queued job ends at once; a running one is asked to stop (its worker marks it cancelled
 * at its next progress write). Returns the status it had, or undefined when there is no such job.
 */
export async function requestCancel(db: Db, id: string): Promise<BacktestStatus | undefined> {
  return db.transaction(async (trx) => {
    const row = (await trx('backtests').where({ id }).forUpdate().first('status')) as
      { status: BacktestStatus } | undefined;
    if (row?.status === 'queued')
      await trx('backtests')
        .where({ id })
        .update({ status: 'cancelled', cancel_requested: true, stage: 'cancelled', finished_at: trx.fn.now() });
    if (row?.status === 'running') await trx('backtests').where({ id }).update({ cancel_requested: true });
    return row?.status;
  });
}
