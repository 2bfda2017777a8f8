import type { Knex } from 'knex';
import type { TrackingStatus } from '@shadowloop/simulator/events';
import type { Db } from '../../db/knex.js';
import type { RuleStates } from '../drift-rules/rule-runtime.js';
import type { TrackingState } from './tracking-fold.js';

export type TrackingRaw = {
  status: TrackingStatus;
  last_reading_at: Date | null;
  last_slot_at: Date | null;
  residual_count: string;
  residual_mean: number[] | null;
  residual_m2: number[] | null;
  last_residual: number[] | null;
  worst_band_fraction: number | null;
  rule_state: RuleStates | null;
};

const ms = (d: Date | null) => (d ? d.getTime() : null);
const date = (v: number | null) => (v === null ? null : new Date(v));

/** A loop_tracking row (all its state columns) in API terms. */
export const trackingStateOf = (r: TrackingRaw): TrackingState => ({
  status: r.status,
  lastReadingMs: ms(r.last_reading_at),
  lastSlotMs: ms(r.last_slot_at),
  stats: { count: Number(r.residual_count), mean: r.residual_mean ?? [], m2: r.residual_m2 ?? [] },
  lastResidual: r.last_residual,
  worstBandFraction: r.worst_band_fraction,
  ruleStates: r.rule_state ?? {},
});

export async function readTracking(db: Db, loopId: string): Promise<TrackingState | undefined> {
  const row = (await db('loop_tracking').where({ loop_id: loopId }).first()) as TrackingRaw | undefined;
  return row && trackingStateOf(row);
}

/**
 * Creates the loop's tracking row when missing and locks it until the transaction ends, so that
 * batches for one loop fold their residuals one after the other. Under a lock wait the row returned
 * is the one the other transaction committed (ON CONFLICT DO UPDATE takes the newest version), so the
 * statement may also run as a CTE of a bigger one (readings.repository.ts). One parameter: the loop id.
 */
export const LOCK_TRACKING_SQL = `INSERT INTO loop_tracking (loop_id) VALUES (?::uuid)
    ON CONFLICT (loop_id) DO UPDATE SET loop_id = EXCLUDED.loop_id RETURNING *`;

export async function lockTracking(trx: Knex.Transaction, loopId: string): Promise<TrackingState> {
  const { rows } = (await trx.raw(LOCK_TRACKING_SQL, [loopId])) as { rows: TrackingRaw[] };
  return trackingStateOf(rows[0]);
}

export async function saveTracking(trx: Db, loopId: string, s: TrackingState): Promise<void> {
  await trx('loop_tracking')
    .where({ loop_id: loopId })
    .update({
      status: s.status,
      last_reading_at: date(s.lastReadingMs),
      last_slot_at: date(s.lastSlotMs),
      residual_count: s.stats.count,
      residual_mean: s.stats.mean,
      residual_m2: s.stats.m2,
      last_residual: s.lastResidual,
      worst_band_fraction: s.worstBandFraction,
      rule_state: JSON.stringify(s.ruleStates),
      updated_at: trx.fn.now(),
    });
}
