import type { BacktestResults } from '../../contracts/backtests.js';
import type { Db } from '../../db/knex.js';

/** A job as its worker runs it. */
export interface ClaimedJob {
  id: string;
  loopId: string;
  versionIds: string[];
  source: 'range' | 'upload';
  /** Epoch ms of [from, to) for a range job. */
  fromMs: number | null;
  toMs: number | null;
  attempts: number;
}

/** A running job whose worker went silent this long is taken to be dead. */
export const HEARTBEAT_TIMEOUT_S = 120;
/** Claims of one job; a job that was running this many times when its worker died fails. */
export const MAX_ATTEMPTS = 3;

type ClaimRaw = {
  id: string;
  loop_id: string;
  version_ids: string[];
  source: 'range' | 'upload';
  range_from: Date | null;
  range_to: Date | null;
  attempts: number;
};

/** The oldest queued job, now running for `workerId`; other workers skip the locked row. */
export async function claimJob(db: Db, workerId: string): Promise<ClaimedJob | undefined> {
  const { rows } = await db.raw<{ rows: ClaimRaw[] }>(
    `UPDATE backtests SET status = 'running', claimed_by = ?, heartbeat_at = now(), attempts = attempts + 1,
       started_at = coalesce(started_at, now()), stage = 'starting'
     WHERE id = (SELECT id FROM backtests WHERE status = 'queued' ORDER BY created_at, id FOR UPDATE SKIP LOCKED LIMIT 1)
     RETURNING id, loop_id, version_ids, source, range_from, range_to, attempts`,
    [workerId],
  );
  const row = rows[0];
  return (
    row && {
      id: row.id,
      loopId: row.loop_id,
      versionIds: row.version_ids,
      source: row.source,
      fromMs: row.range_from?.getTime() ?? null,
      toMs: row.range_to?.getTime() ?? null,
      attempts: row.attempts,
    }
  );
}

/**
 * Running jobs whose heartbeat is older than HEARTBEAT_TIMEOUT_S belong to a process that died:
 * back to the queue, or failed after MAX_ATTEMPTS claims (cancelled when a cancel was asked for).
 * Returns how many were touched.
 */
export async function requeueSilentJobs(db: Db): Promise<number> {
  const { rowCount } = await db.raw<{ rowCount: number }>(
    `UPDATE backtests SET
       status = CASE WHEN cancel_requested THEN 'cancelled' WHEN attempts >= ? THEN 'failed' ELSE 'queued' END,
       error = CASE WHEN cancel_requested OR attempts < ? THEN error
         ELSE 'The api process running this backtest stopped ' || attempts || ' times; it was given up.' END,
       stage = CASE WHEN cancel_requested THEN 'cancelled' WHEN attempts >= ? THEN 'failed'
         ELSE 'waiting for a worker (its previous worker stopped)' END,
       finished_at = CASE WHEN cancel_requested OR attempts >= ? THEN now() END,
       progress = 0, claimed_by = NULL
     WHERE status = 'running' AND heartbeat_at < now() - make_interval(secs => ?)`,
    [MAX_ATTEMPTS, MAX_ATTEMPTS, MAX_ATTEMPTS, MAX_ATTEMPTS, HEARTBEAT_TIMEOUT_S],
  );
  return rowCount;
}

/** Back to the queue when its process shuts down cleanly; the claim does not count as an attempt. */
export async function releaseJob(db: Db, id: string, workerId: string): Promise<void> {
  await db('backtests')
    .where({ id, claimed_by: workerId, status: 'running' })
    .update({
      status: db.raw(`CASE WHEN cancel_requested THEN 'cancelled' ELSE 'queued' END`),
      finished_at: db.raw('CASE WHEN cancel_requested THEN now() END'),
      stage: db.raw(
        `CASE WHEN cancel_requested THEN 'cancelled' ELSE 'waiting for a worker (its api process stopped)' END`,
      ),
      attempts: db.raw('greatest(attempts - 1, 0)'),
      claimed_by: null,
      progress: 0,
    });
}

/**
 * Progress, stage and heartbeat of a job this worker holds. Returns 'cancel' when a cancel was
 * asked for, 'lost' when the job is no longer this worker's (re-queued after a long silence).
 */
export async function writeProgress(
  db: Db,
  id: string,
  workerId: string,
  progress: number,
  stage: string,
): Promise<'go' | 'cancel' | 'lost'> {
  const [row] = await db('backtests')
    .where({ id, claimed_by: workerId, status: 'running' })
    .update({ progress: Math.min(1, Math.max(0, progress)), stage, heartbeat_at: db.fn.now() })
    .returning<{ cancel_requested: boolean }[]>('cancel_requested');
  if (!row) return 'lost';
  return row.cancel_requested ? 'cancel' : 'go';
}

/**
 * The job's end in one UPDATE (results and status together, so a crash never leaves half of them):
 * succeeded with results, or failed / cancelled. A cancel asked for meanwhile wins over success.
 */
export async function finishJob(
  db: Db,
  id: string,
  workerId: string,
  end: { results: BacktestResults } | { failed: string } | { cancelled: true },
): Promise<void> {
  const succeeded = 'results' in end;
  await db.raw(
    `UPDATE backtests SET
       status = CASE WHEN ? AND NOT cancel_requested THEN 'succeeded' WHEN ? THEN 'failed' ELSE 'cancelled' END,
       results = CASE WHEN ? AND NOT cancel_requested THEN ?::jsonb END,
       error = ?,
       progress = CASE WHEN ? AND NOT cancel_requested THEN 1 ELSE progress END,
       stage = CASE WHEN ? AND NOT cancel_requested THEN 'done' WHEN ? THEN 'failed' ELSE 'cancelled' END,
       finished_at = now(), heartbeat_at = now()
     WHERE id = ? AND claimed_by = ? AND status = 'running'`,
    [
      succeeded,
      'failed' in end,
      succeeded,
      succeeded ? JSON.stringify(end.results) : null,
      'failed' in end ? end.failed : null,
      succeeded,
      succeeded,
      'failed' in end,
      id,
      workerId,
    ],
  );
}
