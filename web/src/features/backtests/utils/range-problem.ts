import { formatDuration } from '../../../lib/format-number';
import { LIMITS } from '../types';
import { count } from './backtest-words';

/**
 * What is wrong with a range of stored readings for a backtest, in words, or null. The range is
 * [from, to) on the loop's sample grid, so it holds about (to − from) / T slots.
 */
export function rangeProblem(fromMs: number, toMs: number, samplePeriodS: number): string | null {
  if (Number.isNaN(fromMs) || Number.isNaN(toMs)) return 'Enter both a start and an end.';
  if (fromMs >= toMs) return 'The start must be before the end.';
  const slots = Math.ceil((toMs - fromMs) / (samplePeriodS * 1000));
  if (slots > LIMITS.maxSamples) {
    return `That range holds about ${count(slots)} samples at ${samplePeriodS} s a sample; a backtest takes at most ${count(LIMITS.maxSamples)} (${formatDuration(LIMITS.maxSamples * samplePeriodS)}). Choose a shorter range.`;
  }
  return null;
}
