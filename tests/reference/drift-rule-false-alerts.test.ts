import { describe, expect, it } from 'vitest';
import type { BandParams, CusumParams } from '../../api/src/contracts/alerts.js';
import { evaluateRules } from '../../api/src/modules/drift-rules/rule-evaluation.js';
import { expectationOf } from '../../api/src/modules/drift-rules/rule-expectation.js';
import type { RuleInForce, RuleReading, RuleStates } from '../../api/src/modules/drift-rules/rule-runtime.js';
import { expectMatchesPrinted, seededRandom } from './support.js';

/**
 * Seeded Monte-Carlo runs of the band and CUSUM rules on in-control residuals, independent N(0, 1)
 * per output: the mean number of samples from a fresh start to a false raise (counting the raising
 * sample; the rule restarts from a fresh state after each raise) must agree with the interval the
 * rule editor shows (expectationOf, from the engine's persistenceArl and cusumArl) within four
 * standard errors of the simulated mean.
 */
const BATCH = 32;

/** Standard normal deviates by the Box–Muller transform (Box & Muller, Ann. Math. Statist. 1958). */
function seededNormal(seed: number): () => number {
  const uniform = seededRandom(seed);
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

function simulatedRunLengths(rule: RuleInForce, outputs: number, samples: number, seed: number, shift = 0): number[] {
  const normal = seededNormal(seed);
  const ctx = {
    outputs: Array.from({ length: outputs }, (_, i) => ({ name: `y${i}`, unit: '1' })),
    samplePeriodS: 1,
    innovationCovInverse: null,
  };
  const lengths: number[] = [];
  let states: RuleStates = {};
  let runStart = 0;
  let k = 0;
  while (k < samples) {
    const batch: RuleReading[] = [];
    for (let i = 0; i < BATCH; i++, k++) {
      const residual = Array.from({ length: outputs }, (_, i) => normal() + (i === 0 ? shift : 0));
      batch.push({ k, slotMs: k * 1000, measured: residual, predicted: null, residual });
    }
    for (let offset = 0; offset < batch.length;) {
      const result = evaluateRules([rule], states, ctx, batch.slice(offset));
      const raise = result.transitions.find((t) => t.event === 'raise');
      if (!raise) {
        states = result.states;
        break;
      }
      lengths.push(raise.k - runStart + 1);
      runStart = raise.k + 1;
      states = {};
      offset = raise.k + 1 - batch[0].k;
    }
  }
  return lengths;
}

function meanAndStandardError(values: number[]) {
  const n = values.length;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const variance = values.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1);
  return { mean, standardError: Math.sqrt(variance / n), runs: n };
}

function expectAgreement(rule: RuleInForce, outputs: number, samples: number, seed: number): number {
  const predicted = expectationOf(rule.kind, rule.params, 1, outputs).falseAlertIntervalSamples as number;
  const { mean, standardError, runs } = meanAndStandardError(simulatedRunLengths(rule, outputs, samples, seed));
  const label = `simulated ${mean.toFixed(2)} ± ${standardError.toFixed(2)} (${runs} runs), predicted ${predicted.toFixed(2)}`;
  // meaningful: the simulation pins the mean to a few per cent
  expect(standardError / predicted, label).toBeLessThan(0.03);
  expect(Math.abs(mean - predicted), label).toBeLessThanOrEqual(4 * standardError);
  return mean;
}

const bandRule = (params: Partial<BandParams>, outputs: number): RuleInForce => ({
  id: 'band',
  kind: 'band',
  enabled: true,
  priority: 2,
  version: 1,
  params: { mode: 'sigma', k: 2, sigma: Array(outputs).fill(1), raiseAfter: 1, clearAfter: 1, deadband: 0, ...params },
});

const cusumRule = (params: Partial<CusumParams>): RuleInForce => ({
  id: 'cusum',
  kind: 'cusum',
  enabled: true,
  priority: 2,
  version: 1,
  params: { k: 0.5, h: 4, sigma: [1], shift: 1, ...params },
});

describe('band rule false alerts: runs of consecutive exceedances', () => {
  // expected waiting time for r consecutive successes of probability p, (1 − p^r)/((1 − p) p^r):
  // W. Feller, An Introduction to Probability Theory and Its Applications, vol. 1, 3rd ed., §XIII.7
  it('k = 1.5σ, two in a row, one output', () => {
    expectAgreement(bandRule({ k: 1.5, raiseAfter: 2 }, 1), 1, 150_000, 11);
  });

  it('k = 1σ, three in a row, one output', () => {
    expectAgreement(bandRule({ k: 1, raiseAfter: 3 }, 1), 1, 100_000, 12);
  });

  it('k = 2σ, two in a row on either of two outputs', () => {
    expectAgreement(bandRule({ k: 2, raiseAfter: 2 }, 2), 2, 300_000, 13);
  });
});

describe('CUSUM rule false alerts: two-sided in-control ARL', () => {
  it('k = 0.5, h = 4: the engine and the simulation agree, and both with the printed 168', () => {
    // J. M. Lucas and R. B. Crosier, "Fast initial response for CUSUM quality-control schemes",
    // Technometrics 24(3), 1982, Table 1: two-sided ARL 168 at k = 0.5, h = 4, no shift
    const rule = cusumRule({ k: 0.5, h: 4 });
    expectMatchesPrinted(expectationOf('cusum', rule.params, 1, 1).falseAlertIntervalSamples as number, '168');
    expectAgreement(rule, 1, 450_000, 21);
  });

  it('two outputs: about ARL/2, an approximation that errs a little on the short side', () => {
    // the first false alert of p independent detectors, ARL/p, treats each run length as geometric;
    // a CUSUM run cannot end in its first few samples, so the true interval is somewhat longer
    const rule = cusumRule({ k: 0.5, h: 4, sigma: [1, 1] });
    const predicted = expectationOf('cusum', rule.params, 1, 2).falseAlertIntervalSamples as number;
    const { mean, standardError } = meanAndStandardError(simulatedRunLengths(rule, 2, 450_000, 23));
    expect(mean + 4 * standardError).toBeGreaterThan(predicted);
    expect(mean).toBeLessThan(1.1 * predicted);
  });
});

describe('CUSUM rule detection delay', () => {
  it('k = 0.5, h = 5, a 1σ shift: the engine and the simulation agree, and both with the printed 10.4', () => {
    // D. C. Montgomery, Introduction to Statistical Quality Control, two-sided tabular CUSUM with
    // k = ½, h = 5: ARL 10.4 at a 1σ shift (from memory)
    const rule = cusumRule({ k: 0.5, h: 5, shift: 1 });
    const predicted = expectationOf('cusum', rule.params, 1, 1).detectionDelaySamples as number;
    expectMatchesPrinted(predicted, '10.4');
    const { mean, standardError, runs } = meanAndStandardError(simulatedRunLengths(rule, 1, 60_000, 24, 1));
    const label = `simulated ${mean.toFixed(3)} ± ${standardError.toFixed(3)} (${runs} runs), predicted ${predicted.toFixed(3)}`;
    expect(standardError / predicted, label).toBeLessThan(0.01);
    expect(Math.abs(mean - predicted), label).toBeLessThanOrEqual(4 * standardError);
  });
});
