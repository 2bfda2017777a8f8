import type { TwinPublisher } from '../../realtime/publisher.js';
import type { ScoredReading, TrackingState } from '../tracking/tracking-fold.js';
import { deriveStatus } from '../tracking/tracking-status.js';
import type { LiveLoop } from './live-loop.js';

const iso = (ms: number) => new Date(ms).toISOString();

/**
 * After commit: the newest stored reading of the batch as a twin sample to the loop's room, and a
 * status change (as people see it, stale derived) to the loop's area room.
 */
export function announceBatch(
  publisher: TwinPublisher,
  target: LiveLoop,
  outcome: { before: TrackingState; after: TrackingState; stored: ScoredReading[] },
  nowMs: number,
): void {
  const snapshot = (s: TrackingState) =>
    deriveStatus(
      {
        stored: s.status,
        lastReadingMs: s.lastReadingMs,
        hasTwin: target.hasTwin,
        samplePeriodS: target.samplePeriodS,
        staleAfterSamples: target.staleAfterSamples,
      },
      nowMs,
    );
  const status = snapshot(outcome.after);
  const newest = outcome.stored[outcome.stored.length - 1];
  publisher.sample({
    loopId: target.id,
    t: iso(newest.slotMs),
    k: newest.k,
    predicted: newest.predicted ?? [],
    measured: newest.measured,
    residual: newest.residual,
    status,
  });
  const previousStatus = snapshot(outcome.before);
  if (status !== previousStatus) {
    publisher.statusChanged({
      loopId: target.id,
      area: target.area,
      status,
      previousStatus,
      at: iso(nowMs),
      lastReadingAt: outcome.after.lastReadingMs === null ? null : iso(outcome.after.lastReadingMs),
      worstBandFraction: outcome.after.worstBandFraction,
    });
  }
}
