import { formatDuration, formatNumber, plural } from '../../../lib/format-number';
import { timeToReach } from './step-metrics';

/** `Steady-state gain 0.42 mg/L per %; reaches 95 % after 3.2 min (38 samples).` */
export function stepSummary(series: number[], t: number[], gain: number | null, gainUnit: string): string {
  const gainText =
    gain === null
      ? 'No steady-state gain: the response keeps ramping (an integrating mode)'
      : `Steady-state gain ${formatNumber(gain)} ${gainUnit}`;
  const reach = timeToReach(series, t, gain);
  switch (reach.kind) {
    case 'reached':
      return `${gainText}; reaches 95 % after ${formatDuration(reach.timeS)} (${plural(reach.sample, 'sample')}).`;
    case 'not-reached':
      return `${gainText}; does not reach 95 % within the horizon — lengthen it.`;
    case 'no-change':
      return `${gainText}: this input leaves this output unchanged in the long run.`;
    case 'no-final-value':
      return `${gainText}.`;
  }
}

export function gainUnit(outputUnit: string, inputUnit: string): string {
  if (!outputUnit && !inputUnit) return 'per unit input';
  return `${outputUnit || 'units'} per ${inputUnit || 'unit'}`;
}
