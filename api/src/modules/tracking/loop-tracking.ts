import type { Knex } from 'knex';
import type { TrackingStatus } from '@shadowloop/simulator/events';
import type { LoopTrackingFields } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import { TWIN_RUNNING_SQL } from '../readings/live-loop.js';
import { deriveStatus } from './tracking-status.js';

/** Columns joinTracking adds to a loops row (which has l.sample_period_s). */
export interface TrackingColumns {
  sample_period_s: number;
  stale_after_samples: number;
  tracking_has_twin: boolean;
  tracking_status: TrackingStatus | null;
  tracking_last_reading_at: Date | null;
  tracking_worst_band_fraction: number | null;
}

/**
 * For the loop list and loop page (api/src/modules/loops): left-joins loop_tracking onto a loops
 * query aliased `l`. Pair it with {@link trackingFieldsOf} on each row.
 */
export function joinTracking(db: Db, query: Knex.QueryBuilder): Knex.QueryBuilder {
  return query
    .leftJoin('loop_tracking as lt', 'lt.loop_id', 'l.id')
    .select(
      'l.stale_after_samples',
      db.raw(`${TWIN_RUNNING_SQL} AS tracking_has_twin`),
      'lt.status as tracking_status',
      'lt.last_reading_at as tracking_last_reading_at',
      'lt.worst_band_fraction as tracking_worst_band_fraction',
    );
}

/** status (stale derived now), lastReadingAt and worstBandFraction of a row from joinTracking. */
export function trackingFieldsOf(row: TrackingColumns, nowMs = Date.now()): LoopTrackingFields {
  const lastReadingMs = row.tracking_last_reading_at ? row.tracking_last_reading_at.getTime() : null;
  return {
    status: deriveStatus(
      {
        stored: row.tracking_status ?? 'no_twin',
        lastReadingMs,
        hasTwin: row.tracking_has_twin,
        samplePeriodS: row.sample_period_s,
        staleAfterSamples: row.stale_after_samples,
      },
      nowMs,
    ),
    lastReadingAt: row.tracking_last_reading_at ? row.tracking_last_reading_at.toISOString() : null,
    worstBandFraction: row.tracking_worst_band_fraction,
  };
}
