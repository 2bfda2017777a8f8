import { createStepper, type Stepper } from '../engine/index.js';
import type { ActiveModel } from '../registry/hot-swap.js';
import { createCorrector, type Corrector } from './correction.js';
import { periodMsOf } from './slot-clock.js';

/**
 * The running twin of one leased loop. `x` is the prior estimate x̂(next | next−1) of slot `next`
 * (the next slot to process) and `predicted` its output ŷ(next) with the inputs held; every buffer
 * is allocated here once, so stepping allocates nothing.
 */
export interface LoopTwin {
  readonly loopId: string;
  readonly periodMs: number;
  staleAfterSamples: number;
  readonly active: ActiveModel;
  readonly corrector: Corrector;
  readonly stepper: Stepper;
  x: Float64Array;
  scratch: Float64Array;
  /** The inputs of the newest reading, held while readings are missing. */
  readonly u: Float64Array;
  readonly y: Float64Array;
  readonly yHat: Float64Array;
  readonly predicted: Float64Array;
  next: number;
  lastMeasuredK: number | null;
  /** The slot the twin was adopted at: staleness counts from here when no reading was ever seen. */
  readonly adoptedAt: number;
  /** The state changed since it was last persisted. */
  dirty: boolean;
}

export interface TwinStart {
  next: number;
  /** Carried state (engineering units); the version's operating point when absent. */
  x?: ArrayLike<number>;
  /** Held inputs; the operating point when absent or of another length. */
  u?: ArrayLike<number>;
  lastMeasuredK?: number | null;
  /** Where staleness counts from while no reading was ever seen; `next` when absent. */
  adoptedAt?: number;
  staleAfterSamples: number;
}

export function createLoopTwin(active: ActiveModel, start: TwinStart): LoopTwin {
  const { A, B, C, x0, u0 } = active.model;
  const n = A.length;
  const m = B[0]?.length ?? 0;
  const p = C ? C.length : n;
  const pick = (given: ArrayLike<number> | undefined, fallback: number[] | undefined, length: number) =>
    given && given.length === length
      ? Float64Array.from(given)
      : fallback
        ? Float64Array.from(fallback)
        : new Float64Array(length);
  const twin: LoopTwin = {
    loopId: active.loopId,
    periodMs: periodMsOf(active.samplePeriodS),
    staleAfterSamples: start.staleAfterSamples,
    active,
    corrector: createCorrector(active),
    stepper: createStepper(active.model),
    x: pick(start.x, x0, n),
    scratch: new Float64Array(n),
    u: pick(start.u, u0, m),
    y: new Float64Array(p),
    yHat: new Float64Array(p),
    predicted: new Float64Array(p),
    next: start.next,
    lastMeasuredK: start.lastMeasuredK ?? null,
    adoptedAt: start.adoptedAt ?? start.next,
    dirty: true,
  };
  refreshPrediction(twin);
  return twin;
}

/** ŷ(next) from the prior state with the inputs held (D acts on the held inputs). */
export function refreshPrediction(twin: LoopTwin): void {
  twin.stepper(twin.x, twin.u, twin.scratch, twin.predicted);
}

/** Slots since the newest reading, counted at slot k. */
export function missingSamples(twin: LoopTwin, k: number): number {
  return twin.lastMeasuredK === null ? k - twin.adoptedAt + 1 : k - twin.lastMeasuredK;
}

export const isStale = (twin: LoopTwin, k: number) => missingSamples(twin, k) >= twin.staleAfterSamples;

export function hasFiniteState(twin: LoopTwin): boolean {
  for (let i = 0; i < twin.x.length; i++) if (!Number.isFinite(twin.x[i])) return false;
  return true;
}
