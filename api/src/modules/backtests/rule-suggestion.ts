import { cusumArl } from '@shadowloop/simulator/engine';
import type { z } from 'zod';
import type { RuleSuggestionSchema } from '../../contracts/backtests.js';
import { plainDuration, plainSamples } from '../drift-rules/plain-duration.js';
import { expectationOf } from '../drift-rules/rule-expectation.js';

export type RuleSuggestion = z.infer<typeof RuleSuggestionSchema>;

/** One output's one-step residual spread over the recording. */
export interface ResidualSpread {
  /** Sample standard deviation of the residual (output units); null when not known. */
  std: number | null;
  /** Slots with both a measurement and a prediction. */
  scored: number;
}

/** Residuals per output below which a standard deviation is too uncertain to set limits from. */
export const MIN_SCORED_FOR_SUGGESTION = 100;

/**
 * Band: 3 samples in a row, so a single bad reading (a spike, a frozen transmitter's jump) does not
 * raise while a drift does; the multiple k of sigma is taken from this grid (2 … 6 in steps of
 * 0.25), the one whose false-alert interval is nearest a week, like the CUSUM's h.
 */
export const SUGGESTED_BAND_PERSISTENCE = 3;
export const BAND_K_GRID: readonly number[] = Array.from({ length: 17 }, (_, i) => 2 + i / 4);

/** CUSUM reference value: half the 1σ shift it is tuned to detect (E. S. Page, Biometrika 41, 1954). */
export const SUGGESTED_CUSUM_K = 0.5;

/**
 * CUSUM decision intervals tried, 4 … 20 in steps of 0.5. Below 4 the two-sided ARL at k = 0.5
 * is under 170 samples; above 20 a 1σ shift takes over 40 samples to raise.
 */
export const CUSUM_H_GRID: readonly number[] = Array.from({ length: 33 }, (_, i) => 4 + i / 2);

/** The false-alert interval the band and CUSUM suggestions aim at: about one a week. */
export const TARGET_INTERVAL_S = 7 * 86_400;

const threeFigures = (v: number) => Number(v.toPrecision(3));

/**
 * Band and CUSUM settings from the one-step residual standard deviations of a backtest, with their
 * expected false-alert intervals for independent normal residuals (the Rules editor's figures:
 * {@link expectationOf}). CUSUM h: the grid value whose false-alert interval for all outputs
 * (two-sided in-control ARL / outputs) is nearest one week at the loop's sample period on a log
 * scale, so about one false alert a week whatever the period (h = 4 at one sample an hour).
 */
export function suggestRules(
  perOutput: ResidualSpread[],
  samplePeriodS: number,
  names: string[] = perOutput.map((_, i) => `output ${i + 1}`),
): RuleSuggestion {
  if (!(samplePeriodS > 0)) throw new RangeError(`suggestRules: samplePeriodS must be > 0, got ${samplePeriodS}`);
  const missing = whyNoSigma(perOutput, names);
  if (missing) return { sigma: null, band: null, cusum: null, sentence: missing };
  const sigma = perOutput.map((output) => threeFigures(output.std as number));
  const outputs = sigma.length;
  const persistence = SUGGESTED_BAND_PERSISTENCE;
  const k = bandMultiple(outputs, samplePeriodS);
  const bandInterval = bandIntervalOf(k, outputs, samplePeriodS);
  const h = cusumDecisionInterval(outputs, samplePeriodS);
  const cusumInterval = inControlArl(h) / outputs;
  const delay = arlAt(h, 1);
  return {
    sigma,
    band: { k, persistence, limits: sigma.map((s) => threeFigures(k * s)), falseAlertIntervalSamples: bandInterval },
    cusum: { k: SUGGESTED_CUSUM_K, h, falseAlertIntervalSamples: cusumInterval, detectionDelaySamples: delay },
    sentence: [
      `Band ${k}σ with ${persistence} samples in a row (so that a single bad reading does not raise; ${whyChosen(k, BAND_K_GRID, bandInterval * samplePeriodS, 'k')}): about one false alert every ${plainDuration(bandInterval * samplePeriodS)} at this sample period.`,
      `CUSUM k ${SUGGESTED_CUSUM_K}, h ${h} (${whyChosen(h, CUSUM_H_GRID, cusumInterval * samplePeriodS, 'h')}): about one false alert every ${plainDuration(cusumInterval * samplePeriodS)}; a 1σ shift raises it after about ${plainSamples(delay)} (${plainDuration(delay * samplePeriodS)}).`,
      'Both assume independent, normal residuals with these standard deviations; correlated residuals raise more often.',
    ].join(' '),
  };
}

function whyNoSigma(perOutput: ResidualSpread[], names: string[]): string | null {
  if (perOutput.length === 0) return 'No outputs: no rule settings to suggest.';
  for (const [i, output] of perOutput.entries()) {
    if (output.scored < MIN_SCORED_FOR_SUGGESTION) {
      return `Rule settings are suggested from at least ${MIN_SCORED_FOR_SUGGESTION} one-step residuals per output; ${names[i]} has ${output.scored}.`;
    }
    if (output.std === null || !(output.std > 0) || !Number.isFinite(output.std)) {
      return `The one-step residual of ${names[i]} has no spread over this recording (the version predicts it exactly), so no limit can be set from it.`;
    }
  }
  return null;
}

/** The reason for a grid value: the week's target, unless the grid's end kept it from being met. */
function whyChosen(value: number, grid: readonly number[], intervalS: number, name: string): string {
  if (value === grid[0] && intervalS > 1.5 * TARGET_INTERVAL_S) return `the smallest ${name} suggested`;
  if (value === grid[grid.length - 1] && intervalS < TARGET_INTERVAL_S / 1.5) return `the largest ${name} suggested`;
  return 'chosen for about one false alert a week';
}

/** Expected samples between false band alerts at k·sigma, persistence 3, all outputs (the Rules editor's figure). */
function bandIntervalOf(k: number, outputs: number, samplePeriodS: number): number {
  const persistence = SUGGESTED_BAND_PERSISTENCE;
  const sigma = new Array<number>(outputs).fill(1);
  const { falseAlertIntervalSamples } = expectationOf(
    'band',
    { mode: 'sigma', k, sigma, raiseAfter: persistence, clearAfter: persistence, deadband: 0.2 },
    samplePeriodS,
    outputs,
  );
  if (falseAlertIntervalSamples === null)
    throw new Error(`suggestRules: no band interval for ${outputs} outputs at k = ${k}`);
  return falseAlertIntervalSamples;
}

/** The band grid's k whose false-alert interval is nearest one week on a log scale. */
export function bandMultiple(outputs: number, samplePeriodS: number): number {
  const target = TARGET_INTERVAL_S / samplePeriodS;
  let best = BAND_K_GRID[0];
  let distance = Infinity;
  for (const k of BAND_K_GRID) {
    const d = Math.abs(Math.log(bandIntervalOf(k, outputs, samplePeriodS) / target));
    if (d < distance) [best, distance] = [k, d];
  }
  return best;
}

const arls = new Map<string, number>();

/**
 * Two-sided ARL of one output at k = 0.5 and a shift of 0 or 1σ, remembered: the grid has 33
 * values, each costs an integral-equation solve, and every version of a backtest asks again.
 */
function arlAt(h: number, shift: 0 | 1): number {
  const key = `${h}:${shift}`;
  let arl = arls.get(key);
  if (arl === undefined) {
    arl = cusumArl({ k: SUGGESTED_CUSUM_K, h, shift, twoSided: true });
    arls.set(key, arl);
  }
  return arl;
}

const inControlArl = (h: number) => arlAt(h, 0);

/** The grid's h nearest (log scale) the target interval; ARL grows with h, so a bisection finds it. */
export function cusumDecisionInterval(outputs: number, samplePeriodS: number): number {
  const target = TARGET_INTERVAL_S / samplePeriodS;
  const interval = (i: number) => inControlArl(CUSUM_H_GRID[i]) / outputs;
  let low = 0;
  let high = CUSUM_H_GRID.length - 1;
  if (interval(high) <= target) return CUSUM_H_GRID[high];
  // smallest i with interval(i) ≥ target
  while (low < high) {
    const mid = (low + high) >> 1;
    if (interval(mid) >= target) high = mid;
    else low = mid + 1;
  }
  if (low === 0) return CUSUM_H_GRID[0];
  const above = Math.log(interval(low) / target);
  const below = Math.log(target / interval(low - 1));
  return CUSUM_H_GRID[below < above ? low - 1 : low];
}
