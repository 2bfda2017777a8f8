/** Output steady-state gain `C (I − A)^{-1} B + D` from the analysis' state gain; C = I and D = 0 when not given. */
export function outputSteadyStateGain(
  stateGain: number[][] | null,
  C: number[][] | null,
  D: number[][] | null,
): number[][] | null {
  if (!stateGain) return null;
  if (!C) return stateGain.map((row, i) => row.map((value, j) => value + (D?.[i]?.[j] ?? 0)));
  return C.map((cRow, i) =>
    stateGain[0].map((_, j) => cRow.reduce((sum, c, k) => sum + c * stateGain[k][j], 0) + (D?.[i]?.[j] ?? 0)),
  );
}

export type ReachTime =
  | { kind: 'reached'; sample: number; timeS: number }
  | { kind: 'not-reached' }
  | { kind: 'no-final-value' }
  | { kind: 'no-change' };

/** Relative size below which a steady-state gain counts as zero. */
const ZERO_GAIN = 1e-12;

/**
 * First sample at which a step response reaches `fraction` of its final value (sign-aware).
 * The final value is the steady-state gain; without one (an integrator) there is nothing to reach.
 */
export function timeToReach(series: number[], t: number[], finalValue: number | null, fraction = 0.95): ReachTime {
  if (finalValue === null || !Number.isFinite(finalValue)) return { kind: 'no-final-value' };
  const scale = Math.max(...series.map(Math.abs), Math.abs(finalValue));
  if (Math.abs(finalValue) <= ZERO_GAIN * Math.max(scale, 1)) return { kind: 'no-change' };
  const target = fraction * Math.abs(finalValue);
  const sign = Math.sign(finalValue);
  const sample = series.findIndex((value) => value * sign >= target);
  return sample < 0 ? { kind: 'not-reached' } : { kind: 'reached', sample, timeS: t[sample] };
}
