import type { Mode } from '../types';
import { distinctModes, isDivergent, isOnUnitCircle, isPair, settlingTimeS } from './mode-facts';

export type ModeMark = 'slowest' | 'divergent' | 'on-circle';

export type ModeRow = {
  mode: Mode;
  pair: boolean;
  settlingS: number | null;
  periodS: number | null;
  marks: ModeMark[];
};

/** One row per real mode or conjugate pair, slowest first, with its marks spelled out. */
export function modeRows(modes: readonly Mode[], samplePeriodS: number): ModeRow[] {
  return distinctModes(modes).map((mode, index) => {
    const marks: ModeMark[] = [];
    if (index === 0) marks.push('slowest');
    if (isDivergent(mode)) marks.push('divergent');
    else if (isOnUnitCircle(mode)) marks.push('on-circle');
    return {
      mode,
      pair: isPair(mode),
      settlingS: settlingTimeS(mode),
      periodS: mode.periodSamples === null ? null : mode.periodSamples * samplePeriodS,
      marks,
    };
  });
}

export const MODE_MARK_WORDS: Record<ModeMark, string> = {
  slowest: 'slowest',
  divergent: 'grows',
  'on-circle': 'on the circle',
};
