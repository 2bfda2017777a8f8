import type { Signal } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';

/** What the rules need to know of their loop. */
export interface RuleLoop {
  id: string;
  tag: string;
  samplePeriodS: number;
  outputs: Signal[];
  staleAfterSamples: number;
  /** The active version's correction mode, null without an active version. */
  correctionMode: string | null;
}

export async function findRuleLoop(db: Db, loopId: string): Promise<RuleLoop | undefined> {
  const row = (await db('loops as l')
    .leftJoin('model_versions as v', (join) => join.on('v.loop_id', 'l.id').andOnVal('v.status', 'active'))
    .where('l.id', loopId)
    .first(
      'l.id',
      'l.tag',
      'l.sample_period_s',
      'l.outputs',
      'l.stale_after_samples',
      db.raw(`v.correction->>'mode' AS mode`),
    )) as
    | {
        id: string;
        tag: string;
        sample_period_s: number;
        outputs: Signal[];
        stale_after_samples: number;
        mode: string | null;
      }
    | undefined;
  return (
    row && {
      id: row.id,
      tag: row.tag,
      samplePeriodS: row.sample_period_s,
      outputs: row.outputs,
      staleAfterSamples: row.stale_after_samples,
      correctionMode: row.mode,
    }
  );
}

/** The loop's running residual statistics (Welford), as the tracking fold keeps them. */
export async function readResidualStatistics(db: Db, loopId: string) {
  const row = (await db('loop_tracking')
    .where({ loop_id: loopId })
    .first('residual_count', 'residual_mean', 'residual_m2')) as
    { residual_count: string; residual_mean: number[] | null; residual_m2: number[] | null } | undefined;
  return { count: Number(row?.residual_count ?? 0), mean: row?.residual_mean ?? [], m2: row?.residual_m2 ?? [] };
}
