import type { LoopTracking } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import { requireLiveLoop } from '../readings/live-loop.js';
import { emptyStatistics, residualBands } from './residual-statistics.js';
import { readTracking } from './tracking.repository.js';
import { deriveStatus } from './tracking-status.js';

const iso = (ms: number | null) => (ms === null ? null : new Date(ms).toISOString());

/** The loop's tracking as people see it now (stale derived), with its residual statistics and band. */
export async function loopTracking(db: Db, loopId: string): Promise<LoopTracking> {
  const loop = await requireLiveLoop(db, loopId);
  const state = await readTracking(db, loop.id);
  const stats = state && state.stats.mean.length === loop.outputs ? state.stats : emptyStatistics(loop.outputs);
  const known = stats.count > 0;
  return {
    loopId: loop.id,
    status: deriveStatus(
      {
        stored: state?.status ?? 'no_twin',
        lastReadingMs: state?.lastReadingMs ?? null,
        hasTwin: loop.hasTwin,
        samplePeriodS: loop.samplePeriodS,
        staleAfterSamples: loop.staleAfterSamples,
      },
      Date.now(),
    ),
    lastReadingAt: iso(state?.lastReadingMs ?? null),
    lastSlotAt: iso(state?.lastSlotMs ?? null),
    worstBandFraction: state?.worstBandFraction ?? null,
    lastResidual: state?.lastResidual ?? null,
    residualCount: stats.count,
    residualMean: known ? stats.mean : null,
    residualSd: stats.count > 1 ? stats.m2.map((m2) => Math.sqrt(m2 / (stats.count - 1))) : null,
    band: residualBands(stats, loop.residualBand, loop.outputs),
  };
}
