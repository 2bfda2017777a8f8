import type { DriftRuleKind } from '@shadowloop/api/contracts';
import { formatNumber } from '../../../lib/format-number';

type Output = { name: string; unit: string };

const num = (value: unknown) => (typeof value === 'number' ? formatNumber(value) : '—');

function perOutput(values: unknown, outputs: Output[], blank: string): string {
  if (!Array.isArray(values)) return blank;
  return outputs
    .map(
      (o, i) =>
        `${o.name} ${values[i] === null || values[i] === undefined ? 'not watched' : `${num(values[i])}${o.unit ? ` ${o.unit}` : ''}`}`,
    )
    .join(', ');
}

/** A rule's settings in one line of words and units, for read-only views and the history. */
export function describeParams(kind: DriftRuleKind, params: Record<string, unknown>, outputs: Output[]): string {
  const sigma = `sigma ${perOutput(params.sigma, outputs, 'not given')}`;
  const persistence = `raise after ${num(params.raiseAfter)} samples, clear after ${num(params.clearAfter)}`;
  if (kind === 'stale') return `Raise after ${num(params.afterSamples)} sample periods without a reading.`;
  if (kind === 'cusum') {
    return `k ${num(params.k)}, h ${num(params.h)} standard deviations; ${sigma}; delay shown for a shift of ${num(params.shift)}.`;
  }
  if (kind === 'nis')
    return `False-alarm probability ${num(params.falseAlarmProbability)} per sample; ${persistence}; ${sigma}.`;
  const limit =
    params.mode === 'absolute' ? `limits ${perOutput(params.limits, outputs, '—')}` : `limit ${num(params.k)} × sigma`;
  const deadband = typeof params.deadband === 'number' ? `${formatNumber(params.deadband * 100)} %` : '—';
  return `${limit}; ${sigma}; ${persistence}; clear deadband ${deadband}.`;
}
