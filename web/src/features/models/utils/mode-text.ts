import { formatDuration, formatEigenvalue, formatNumber, formatSamples } from '../../../lib/format-number';
import type { Mode } from '../types';
import { isDivergent, isOnUnitCircle, settlingTimeS } from './mode-facts';

/** One mode in a line, for the plot's readout: what it is and what it does. */
export function describeModeText(mode: Mode, samplePeriodS: number): string {
  const parts = [`λ = ${formatEigenvalue(mode.eigenvalue)}`, `|λ| = ${formatNumber(mode.magnitude)}`];
  if (isDivergent(mode)) parts.push(`grows by ${formatNumber((mode.magnitude - 1) * 100, 2)} % per sample`);
  else if (isOnUnitCircle(mode)) parts.push('on the unit circle: neither decays nor grows');
  else if (mode.magnitude === 0) parts.push('gone after one sample');
  else
    parts.push(
      `time constant ${formatDuration(mode.timeConstantS)}`,
      `settles in about ${formatDuration(settlingTimeS(mode))}`,
    );
  if (mode.periodSamples !== null) {
    parts.push(
      `oscillates every ${formatSamples(mode.periodSamples)} (${formatDuration(mode.periodSamples * samplePeriodS)})`,
    );
  }
  return parts.join(' · ');
}
