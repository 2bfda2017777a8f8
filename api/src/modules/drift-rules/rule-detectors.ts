import { chiSquareQuantile, cusumStep } from '@shadowloop/simulator/engine';
import type { BandParams, CusumParams, NisParams } from '../../contracts/alerts.js';
import type { RuleRuntime } from './rule-runtime.js';

/**
 * The per-sample detectors behind the band, cusum and nis rules. Each moves a rule's runtime state
 * on by one residual vector, in place, and says whether the rule raised or cleared on it.
 */
export interface DetectorStep {
  event: 'raise' | 'clear' | null;
  statistic: { name: string; value: number; limit: number };
}

export interface Detector {
  step(state: RuleRuntime, residual: number[]): DetectorStep;
  /** Per output limit in output units (band), else null. */
  limits: (number | null)[] | null;
}

/**
 * Persistence on both sides: `raiseAfter` consecutive samples over the limit raise, `clearAfter`
 * consecutive samples inside the clear limit clear. A sample between the two limits breaks both
 * counts, so a residual hovering at the limit neither raises nor clears again and again.
 */
function persist(state: RuleRuntime, over: boolean, inside: boolean, raiseAfter: number, clearAfter: number) {
  if (!state.raised) {
    state.over = over ? state.over + 1 : 0;
    if (state.over < raiseAfter) return null;
    Object.assign(state, { raised: true, over: 0, inside: 0 });
    return 'raise' as const;
  }
  state.inside = inside ? state.inside + 1 : 0;
  if (state.inside < clearAfter) return null;
  Object.assign(state, { raised: false, over: 0, inside: 0 });
  return 'clear' as const;
}

/** limit_i: `limits[i]` (absolute) or k·sigma_i (sigma mode); null for an output the rule does not watch. */
export function bandLimits(params: BandParams, outputs: number): (number | null)[] {
  return Array.from({ length: outputs }, (_, i) => {
    if (params.mode === 'absolute') return params.limits?.[i] ?? null;
    const sigma = params.sigma?.[i];
    return sigma !== undefined && params.k !== undefined ? params.k * sigma : null;
  });
}

export function bandDetector(params: BandParams, outputs: number): Detector | null {
  const limits = bandLimits(params, outputs);
  if (!limits.some((limit) => limit !== null)) return null;
  const clearBelow = 1 - params.deadband;
  return {
    limits,
    step(state, residual) {
      let ratio = 0;
      limits.forEach((limit, i) => {
        if (limit !== null) ratio = Math.max(ratio, Math.abs(residual[i]) / limit);
      });
      state.level = ratio;
      const event = persist(state, ratio > 1, ratio < clearBelow, params.raiseAfter, params.clearAfter);
      return { event, statistic: { name: 'largest |residual| / limit', value: ratio, limit: 1 } };
    },
  };
}

/**
 * While raised, each CUSUM sum is held at most at this many h: the rule is raised already, and an
 * unbounded sum would keep a long fault's alert raised for hours after the repair (it falls by
 * about k per in-control sample). The alert clears when every sum is back to 0, about
 * CUSUM_HOLD·h/k samples after the residual returns to normal; a new raise then needs a full h of
 * fresh evidence, which is the hysteresis that keeps the rule from chattering.
 */
export const CUSUM_HOLD = 2;

export function cusumDetector(params: CusumParams, outputs: number): Detector | null {
  if (params.sigma.length !== outputs) return null;
  const design = { k: params.k, h: params.h };
  const hold = CUSUM_HOLD * params.h;
  return {
    limits: null,
    step(state, residual) {
      if (state.upper.length !== outputs || state.lower.length !== outputs) {
        state.upper = new Array<number>(outputs).fill(0);
        state.lower = new Array<number>(outputs).fill(0);
      }
      let signal = false;
      let largest = 0;
      for (let i = 0; i < outputs; i++) {
        const next = cusumStep({ upper: state.upper[i], lower: state.lower[i] }, residual[i] / params.sigma[i], design);
        state.upper[i] = next.upper;
        state.lower[i] = next.lower;
        signal ||= next.signal !== 'none';
        largest = Math.max(largest, next.upper, next.lower);
      }
      state.level = largest / params.h;
      let event: DetectorStep['event'] = null;
      if (!state.raised && signal) event = 'raise';
      else if (state.raised && largest === 0) event = 'clear';
      if (event) state.raised = event === 'raise';
      if (state.raised) {
        for (let i = 0; i < outputs; i++) {
          state.upper[i] = Math.min(state.upper[i], hold);
          state.lower[i] = Math.min(state.lower[i], hold);
        }
      }
      return { event, statistic: { name: 'largest CUSUM sum (σ)', value: largest, limit: params.h } };
    },
  };
}

const quantiles = new Map<string, number>();

/** The chi-square limit of the NIS, remembered: the quantile is iterative and rules reuse a few values. */
export function nisLimit(falseAlarmProbability: number, outputs: number): number {
  const key = `${falseAlarmProbability}:${outputs}`;
  let limit = quantiles.get(key);
  if (limit === undefined) {
    limit = chiSquareQuantile(1 - falseAlarmProbability, outputs);
    if (quantiles.size < 1000) quantiles.set(key, limit);
  }
  return limit;
}

const isSquare = (M: number[][] | null, p: number): M is number[][] =>
  M !== null && M.length === p && M.every((row) => row.length === p && row.every(Number.isFinite));

/**
 * rᵀ S⁻¹ r, the normalised innovation squared (the engine's `nis(r, S)`, here with S⁻¹ already
 * inverted once per rule set instead of solved at every sample).
 */
export function quadraticForm(residual: number[], inverse: number[][]): number {
  let sum = 0;
  for (let i = 0; i < residual.length; i++) {
    let row = 0;
    for (let j = 0; j < residual.length; j++) row += inverse[i][j] * residual[j];
    sum += residual[i] * row;
  }
  return sum;
}

/** S⁻¹: the Kalman correction's innovation covariance inverted, else diag(1/sigma²); null when neither is known. */
export function nisInverse(params: NisParams, outputs: number, covInverse: number[][] | null): number[][] | null {
  if (isSquare(covInverse, outputs)) return covInverse;
  const sigma = params.sigma;
  if (!sigma || sigma.length !== outputs) return null;
  return sigma.map((s, i) => sigma.map((_, j) => (i === j ? 1 / (s * s) : 0)));
}

export function nisDetector(params: NisParams, outputs: number, covInverse: number[][] | null): Detector | null {
  const inverse = nisInverse(params, outputs, covInverse);
  if (!inverse) return null;
  const limit = nisLimit(params.falseAlarmProbability, outputs);
  return {
    limits: null,
    step(state, residual) {
      const value = quadraticForm(residual, inverse);
      state.level = value / limit;
      const event = persist(state, value > limit, value < limit, params.raiseAfter, params.clearAfter);
      return { event, statistic: { name: 'NIS', value, limit } };
    },
  };
}
