import { cusumArl, normalCdf, persistenceArl } from '@shadowloop/simulator/engine';
import type {
  BandParams,
  CusumParams,
  DriftRuleKind,
  DriftRuleParams,
  NisParams,
  RuleExpectation,
  StaleParams,
} from '../../contracts/alerts.js';
import { plainDuration, plainSamples } from './plain-duration.js';

/**
 * What an engineer should expect of a rule on residuals that match the model (independent,
 * normal, zero mean, standard deviation sigma): the mean interval between false alerts and, for
 * CUSUM, the mean delay to raise after a shift.
 */
export function expectationOf(
  kind: DriftRuleKind,
  params: DriftRuleParams,
  samplePeriodS: number,
  outputs: number,
): RuleExpectation {
  if (kind === 'stale') return staleExpectation(params as StaleParams, samplePeriodS);
  if (kind === 'cusum') return cusumExpectation(params as CusumParams, samplePeriodS, outputs);
  if (kind === 'nis') {
    const p = params as NisParams;
    const interval = persistenceArl(p.falseAlarmProbability, p.raiseAfter);
    return withSentence(interval, null, null, samplePeriodS, 'if the model and its innovation covariance are right');
  }
  const interval = bandInterval(params as BandParams, outputs);
  if (interval === null) {
    return {
      ...empty(),
      sentence:
        'The false-alert interval needs the residual standard deviation of each output: add sigma (the editor can suggest it from the loop’s residuals).',
    };
  }
  return withSentence(interval, null, null, samplePeriodS);
}

const empty = () => ({
  falseAlertIntervalSamples: null,
  falseAlertIntervalHours: null,
  detectionDelaySamples: null,
  shiftSigma: null,
});

/**
 * Probability that some watched output is outside its band on one sample, p = 1 − Π(1 − p_i) with
 * p_i = 2(1 − Φ(limit_i/sigma_i)) = 2Φ(−limit_i/sigma_i); the rule raises after `raiseAfter`
 * consecutive such samples (Feller's runs, engine persistenceArl). Exact for independent outputs.
 */
function bandInterval(params: BandParams, outputs: number): number | null {
  const sigma = params.sigma;
  if (!sigma || sigma.length !== outputs) return null;
  let inside = 1;
  for (let i = 0; i < outputs; i++) {
    const limit = params.mode === 'sigma' ? (params.k ?? NaN) * sigma[i] : (params.limits?.[i] ?? null);
    if (limit === null) continue;
    if (!Number.isFinite(limit)) return null;
    inside *= 1 - 2 * normalCdf(-limit / sigma[i]);
  }
  return persistenceArl(Math.min(1, Math.max(0, 1 - inside)), params.raiseAfter);
}

/**
 * Two-sided CUSUM per output (engine cusumArl, Lucas & Crosier 1982). With p independent outputs
 * the first false alert of p detectors comes after about ARL/p samples: an approximation that
 * treats each detector's run length as geometric. It errs on the short side, since a run cannot
 * end in its first few samples (about 4 % for two outputs at k = 0.5, h = 4 in the seeded
 * simulation of tests/reference/drift-rule-false-alerts.test.ts). The detection delay is for a
 * shift of `shift` σ on one output.
 */
function cusumExpectation(params: CusumParams, samplePeriodS: number, outputs: number): RuleExpectation {
  const interval = cusumArl({ k: params.k, h: params.h, shift: 0, twoSided: true }) / Math.max(1, outputs);
  const delay = cusumArl({ k: params.k, h: params.h, shift: params.shift, twoSided: true });
  return withSentence(interval, delay, params.shift, samplePeriodS);
}

function staleExpectation(params: StaleParams, samplePeriodS: number): RuleExpectation {
  const after = plainDuration(params.afterSamples * samplePeriodS);
  return {
    ...empty(),
    sentence: `Raises when no reading has arrived for ${plainSamples(params.afterSamples)} (${after} at this sample period); it does not look at the residuals, so it raises no false alerts while readings arrive.`,
  };
}

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

function withSentence(
  intervalSamples: number,
  delaySamples: number | null,
  shift: number | null,
  samplePeriodS: number,
  proviso?: string,
): RuleExpectation {
  const interval = finiteOrNull(intervalSamples);
  const hours = interval === null ? null : finiteOrNull((interval * samplePeriodS) / 3600);
  let first =
    interval === null || hours === null
      ? 'Practically no false alerts at this sample period'
      : `About one false alert every ${plainDuration(interval * samplePeriodS)} at this sample period (1 in ${plainSamples(interval)})`;
  if (proviso) first += `, ${proviso}`;
  let sentence = `${first}.`;
  if (delaySamples !== null && shift !== null) {
    sentence += ` A shift of ${shift}σ raises it after about ${plainSamples(delaySamples)} (${plainDuration(delaySamples * samplePeriodS)}).`;
  }
  return {
    falseAlertIntervalSamples: hours === null ? null : interval,
    falseAlertIntervalHours: hours,
    detectionDelaySamples: delaySamples === null ? null : finiteOrNull(delaySamples),
    shiftSigma: shift,
    sentence,
  };
}
