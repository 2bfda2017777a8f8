import type pg from 'pg';
import type { BacktestResults, VersionBacktest } from '../../contracts/backtests.js';
import type { Db } from '../../db/knex.js';
import { loadRuleSet } from '../drift-rules/rule-set.js';
import { readAlertSettings } from '../oncall/alert-settings.js';
import type { ClaimedJob } from './backtest-jobs.repository.js';
import { compareVersions } from './comparison.js';
import { decimateChart } from './backtest-chart.js';
import { loadReplayVersions } from './backtest-versions.js';
import { loadRangeRecording, loadUploadRecording, type Recording } from './recording.js';
import { requireEnoughReadings } from './backtests.service.js';
import { replayVersions, type ReplayedVersion } from './version-replay.js';

export interface JobDeps {
  db: Db;
  /** For reading recordings with node-postgres directly (text rows, no array parsing). */
  pool: pg.Pool;
}

/**
 * Reports progress (0 … 1) and the stage in words. The worker writes it at most every ~500 ms and
 * throws from here when the job was cancelled or taken away, which ends the run.
 */
export type ProgressReport = (progress: number, stage: string) => Promise<void>;

/** Share of the progress bar for reading the recording; the versions share the rest equally. */
const READING_SHARE = 0.2;
const FINISHING_SHARE = 0.05;

async function loadRecording(
  deps: JobDeps,
  job: ClaimedJob,
  loop: { id: string; samplePeriodS: number },
  shape: { inputs: number; outputs: number },
  report: ProgressReport,
): Promise<Recording> {
  const onSlice = (fraction: number) => report(READING_SHARE * fraction, 'reading the recording');
  if (job.source === 'upload') return loadUploadRecording(deps.db, deps.pool, job.id, shape, { onSlice });
  return loadRangeRecording(deps.db, deps.pool, { ...loop, ...shape }, job.fromMs as number, job.toMs as number, {
    onSlice,
  });
}

/** The versions' statuses and the loop's active version now, as the results record them. */
async function versionStatuses(db: Db, loopId: string, ids: string[]) {
  const rows = (await db('model_versions').where('loop_id', loopId).whereIn('id', ids).select('id', 'status')) as {
    id: string;
    status: string;
  }[];
  return new Map(rows.map((r) => [r.id, r.status]));
}

/**
 * Runs one backtest: reads the recording, replays each version over it (figures of both runs, the
 * drift rules, suggested settings), compares candidate and active, decimates the chart. Returns the
 * results; the worker stores them in one UPDATE with the final status.
 */
export async function runBacktest(deps: JobDeps, job: ClaimedJob, report: ProgressReport): Promise<BacktestResults> {
  const started = performance.now();
  const { db } = deps;
  const { loop, versions } = await loadReplayVersions(db, job.loopId, job.versionIds);
  const shape = { inputs: loop.inputs.length, outputs: loop.outputs.length };
  await report(0, 'reading the recording');
  const recording = await loadRecording(deps, job, loop, shape, report);
  requireEnoughReadings(recording.k.length, 'The recording');
  const [{ rules }, settings] = await Promise.all([loadRuleSet(db, loop.id), readAlertSettings(db)]);
  const ctx = {
    recording,
    samplePeriodS: loop.samplePeriodS,
    outputs: loop.outputs,
    rules,
    targetPerDay: settings.targetPerDay,
  };
  const share = (1 - READING_SHARE - FINISHING_SHARE) / versions.length;
  await report(READING_SHARE, `replaying version ${versions[0].number}`);
  const replayed: ReplayedVersion[] = await replayVersions(versions, ctx, (i, fraction) =>
    report(READING_SHARE + share * (i + fraction), `replaying version ${versions[i].number}`),
  );
  await report(1 - FINISHING_SHARE, 'comparing the versions');
  const statuses = await versionStatuses(db, loop.id, job.versionIds);
  const figures: VersionBacktest[] = replayed.map(({ figures: f }) => {
    const status = statuses.get(f.versionId) ?? 'unknown';
    return { ...f, versionStatus: status, wasActive: status === 'active' };
  });
  const chart = decimateChart({
    k: recording.k,
    samplePeriodS: loop.samplePeriodS,
    measured: recording.y,
    outputs: shape.outputs,
    predictions: replayed.map((r) => ({ versionId: r.figures.versionId, oneStep: r.oneStep, freeRun: r.freeRun })),
  });
  const N = recording.k.length;
  const slots = recording.k[N - 1] - recording.k[0] + 1;
  return {
    versions: figures,
    comparison: compareVersions(figures, loop.outputs),
    chart,
    samples: { slots, measured: N, missing: slots - N },
    elapsedS: (performance.now() - started) / 1000,
  };
}
