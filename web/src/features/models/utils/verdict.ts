import { formatDuration, formatEigenvalue, formatNumber, formatSamples, plural } from '../../../lib/format-number';
import type { Mode, ModelAnalysis, Stability } from '../types';
import {
  distinctModes,
  ILL_CONDITIONED_CONDITION,
  isDivergent,
  isOnUnitCircle,
  isPair,
  settlingTimeS,
} from './mode-facts';

export type Verdict = { stability: Stability; headline: string; sentence: string; notes: string[] };

type VerdictInput = Pick<ModelAnalysis, 'stability' | 'modes' | 'defective' | 'eigenvectorCondition'>;

const HEADLINES: Record<Stability, string> = { stable: 'Stable', marginal: 'Marginal', unstable: 'Unstable' };

function lambda(mode: Mode): string {
  return `λ = ${formatEigenvalue(mode.eigenvalue, 3)}`;
}

function oscillation(mode: Mode, samplePeriodS: number): string {
  if (mode.periodSamples === null) return '';
  if (Math.abs(mode.periodSamples - 2) < 1e-9 && !isPair(mode)) return 'flipping sign every sample';
  const period = formatDuration(mode.periodSamples * samplePeriodS);
  return `oscillating every ${formatSamples(mode.periodSamples)} (${period})`;
}

function stableSentence(modes: Mode[], samplePeriodS: number): string {
  const slowest = modes[0];
  if (slowest.magnitude === 0) {
    const n = modes.length;
    return `Every eigenvalue is 0: the free response dies out completely within ${plural(n, 'sample')} (${formatDuration(n * samplePeriodS)}).`;
  }
  const pair = isPair(slowest);
  const subject = pair ? `The slowest modes, ${lambda(slowest)},` : `The slowest mode, ${lambda(slowest)},`;
  const swing = oscillation(slowest, samplePeriodS);
  const settles = `${pair ? 'settle' : 'settles'} in about ${formatDuration(settlingTimeS(slowest))}`;
  const dominate = pair ? 'they dominate the long-run response' : 'it dominates the long-run response';
  return `${subject} ${settles}${swing ? `, ${swing}` : ''}; ${dominate}.`;
}

function marginalSentence(modes: Mode[], samplePeriodS: number): string {
  const onCircle = modes.filter(isOnUnitCircle);
  const mode = onCircle[0] ?? modes[0];
  const more = onCircle.length - 1;
  const others =
    more > 0 ? ` ${more} more ${more === 1 ? 'eigenvalue sits' : 'eigenvalues sit'} on the circle too.` : '';
  if (!isPair(mode) && mode.eigenvalue.re > 0) {
    return `The mode ${lambda(mode)} sits on the unit circle and integrates: a disturbance never dies out, a constant input makes the state ramp, and there is no steady-state gain.${others}`;
  }
  const subject = isPair(mode) ? `The modes ${lambda(mode)} sit` : `The mode ${lambda(mode)} sits`;
  return `${subject} on the unit circle, ${oscillation(mode, samplePeriodS)} without ever decaying.${others}`;
}

function unstableSentence(modes: Mode[], samplePeriodS: number): string {
  const divergent = modes.filter(isDivergent);
  if (divergent.length === 0) {
    const mode = modes.find(isOnUnitCircle) ?? modes[0];
    return `The eigenvalue ${lambda(mode)} is repeated on the unit circle without independent eigenvectors, so the response grows in proportion to time; the twin's prediction would drift away from the plant.`;
  }
  const fastest = distinctModes(divergent)[0];
  const pair = isPair(fastest);
  const alone = divergent.length === (pair ? 2 : 1);
  const where = alone
    ? `${pair ? 'The modes' : 'The mode'} ${lambda(fastest)} ${pair ? 'lie' : 'lies'} outside the unit circle and ${pair ? 'grow' : 'grows'}`
    : `${divergent.length} eigenvalues lie outside the unit circle; the fastest-growing, ${lambda(fastest)}, grows`;
  const growth = formatNumber((fastest.magnitude - 1) * 100, 2);
  const doubling = Math.log(2) / Math.log(fastest.magnitude);
  const swing = pair ? `, ${oscillation(fastest, samplePeriodS)}` : '';
  return `${where} by ${growth} % per sample, doubling about every ${formatSamples(doubling)} (${formatDuration(doubling * samplePeriodS)})${swing}; the twin's prediction would run away from the plant.`;
}

function conditionNotes(input: VerdictInput): string[] {
  if (input.defective) {
    return [
      'Defective: the eigenvectors do not span the state space, so the response cannot be split into separate modes and the figures per mode are approximate.',
    ];
  }
  if (input.eigenvectorCondition > ILL_CONDITIONED_CONDITION) {
    return [
      `Ill-conditioned: the eigenvectors are nearly parallel (condition number ${formatNumber(input.eigenvectorCondition, 2)}). Small changes to A can move the eigenvalues noticeably, and the states can swing well beyond what the eigenvalues suggest before they settle.`,
    ];
  }
  return [];
}

/** The plain-words verdict on a model, from its analysis and the loop's sample period. */
export function buildVerdict(input: VerdictInput, samplePeriodS: number): Verdict {
  const modes = distinctModes(input.modes);
  const sentence =
    input.stability === 'stable'
      ? stableSentence(modes, samplePeriodS)
      : input.stability === 'marginal'
        ? marginalSentence(modes, samplePeriodS)
        : unstableSentence(input.modes, samplePeriodS);
  return { stability: input.stability, headline: HEADLINES[input.stability], sentence, notes: conditionNotes(input) };
}

export function verdictText(verdict: Verdict): string {
  return [`${verdict.headline}.`, verdict.sentence, ...verdict.notes].join(' ');
}
