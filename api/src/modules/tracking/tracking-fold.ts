import type { TrackingStatus } from '@shadowloop/simulator/events';
import type { RuleStates } from '../drift-rules/rule-runtime.js';
import {
  addResidual,
  emptyStatistics,
  residualBands,
  worstBandFraction,
  type ResidualStatistics,
} from './residual-statistics.js';

/** A loop's tracking row in API terms (times in epoch ms). */
export interface TrackingState {
  status: TrackingStatus;
  lastReadingMs: number | null;
  lastSlotMs: number | null;
  stats: ResidualStatistics;
  lastResidual: number[] | null;
  worstBandFraction: number | null;
  /** The drift rules' detector states (loop_tracking.rule_state), by rule id. */
  ruleStates: RuleStates;
}

/** A stored reading with its residual against the twin's prediction for its slot, when there was one. */
export interface ScoredReading {
  k: number;
  slotMs: number;
  tMs: number;
  measured: number[];
  /** The prediction ŷ; the ingest returns it only for the newest reading of a batch. */
  predicted: number[] | null;
  residual: number[] | null;
}

export interface TrackedLoop {
  outputs: number;
  hasTwin: boolean;
  /** loops.residual_band: one positive number (or null) per output, or null. */
  residualBand: (number | null)[] | null;
}

const KEEPS = new Set<TrackingStatus>(['in_step', 'drifting']);

/**
 * Folds readings (sorted by slot) into the tracking state. Every residual joins the running
 * statistics and is judged against the band as it stood before it; only a reading newer than the
 * last slot moves the status, the last residual and the worst band fraction (late readings are
 * stored but never rewrite the present).
 */
export function foldReadings(state: TrackingState, loop: TrackedLoop, readings: ScoredReading[]): TrackingState {
  const usable = state.stats.mean.length === loop.outputs;
  const stats = usable
    ? { count: state.stats.count, mean: [...state.stats.mean], m2: [...state.stats.m2] }
    : emptyStatistics(loop.outputs);
  const next: TrackingState = { ...state, stats };
  for (const reading of readings) {
    let fraction: number | null = null;
    let outside = false;
    if (reading.residual) {
      const bands = residualBands(stats, loop.residualBand, loop.outputs);
      fraction = worstBandFraction(reading.residual, bands);
      outside = reading.residual.some((r, i) => bands[i] !== null && Math.abs(r) > (bands[i] as number));
      addResidual(stats, reading.residual);
    }
    if (next.lastSlotMs !== null && reading.slotMs <= next.lastSlotMs) continue;
    next.lastSlotMs = reading.slotMs;
    next.lastReadingMs = Math.max(next.lastReadingMs ?? reading.tMs, reading.tMs);
    if (!loop.hasTwin) next.status = 'no_twin';
    else if (reading.residual) {
      next.status = outside ? 'drifting' : 'in_step';
      next.lastResidual = reading.residual;
      next.worstBandFraction = fraction;
    } else next.status = KEEPS.has(next.status) ? next.status : 'in_step';
  }
  return next;
}
