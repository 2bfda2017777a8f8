import type { TrackingStatus } from '@shadowloop/simulator/events';

/** What the stored tracking row and its loop say, with times in epoch ms. */
export interface TrackingSnapshot {
  stored: TrackingStatus;
  lastReadingMs: number | null;
  hasTwin: boolean;
  samplePeriodS: number;
  staleAfterSamples: number;
}

/**
 * The tracking status people see. `stale` is derived when reading: the newest reading is older
 * than stale_after_samples sample periods (or none arrived yet). `no_twin` whenever the loop has no
 * running twin (no active version, or the simulator has not started it), whatever was stored.
 */
export function deriveStatus(s: TrackingSnapshot, nowMs: number): TrackingStatus {
  if (!s.hasTwin) return 'no_twin';
  const staleAfterMs = s.staleAfterSamples * s.samplePeriodS * 1000;
  if (s.lastReadingMs === null || nowMs - s.lastReadingMs > staleAfterMs) return 'stale';
  return s.stored === 'no_twin' || s.stored === 'stale' ? 'in_step' : s.stored;
}
