import type { BandParams, CusumParams, DriftRuleKind, DriftRuleParams, NisParams } from '../../../contracts/alerts.js';
import type { RuleContext, RuleInForce, RuleReading } from '../rule-runtime.js';
import { seededUniform } from '@shadowloop/simulator/seeded-random';

/** Rules, contexts and readings for the drift-rule unit tests (slot k at k seconds). */
export function rule(kind: DriftRuleKind, params: DriftRuleParams, overrides: Partial<RuleInForce> = {}): RuleInForce {
  return { id: `rule-${kind}`, kind, enabled: true, priority: 2, version: 1, params, ...overrides };
}

export const band = (overrides: Partial<BandParams> = {}): BandParams => ({
  mode: 'absolute',
  limits: [1],
  raiseAfter: 3,
  clearAfter: 2,
  deadband: 0.2,
  ...overrides,
});

export const cusum = (overrides: Partial<CusumParams> = {}): CusumParams => ({
  k: 0.5,
  h: 4,
  sigma: [1],
  shift: 1,
  ...overrides,
});

export const nisParams = (overrides: Partial<NisParams> = {}): NisParams => ({
  falseAlarmProbability: 0.01,
  raiseAfter: 2,
  clearAfter: 2,
  ...overrides,
});

export function context(outputs = 1, innovationCovInverse: number[][] | null = null): RuleContext {
  return {
    outputs: Array.from({ length: outputs }, (_, i) => ({ name: `y${i + 1}`, unit: 'm' })),
    samplePeriodS: 1,
    innovationCovInverse,
  };
}

/** Readings at slots start, start+1, … with these residuals (null: no prediction for the slot). */
export function readings(residuals: (number[] | number | null)[], start = 100): RuleReading[] {
  return residuals.map((r, i) => {
    const residual = r === null ? null : Array.isArray(r) ? r : [r];
    return {
      k: start + i,
      slotMs: (start + i) * 1000,
      measured: residual ?? [0],
      predicted: residual ? residual.map(() => 0) : null,
      residual,
    };
  });
}

/** Seeded standard normal deviates (mulberry32 uniforms, Box–Muller), so every run sees the same residuals. */
export function seededNormal(seed: number): () => number {
  const uniform = seededUniform(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}
