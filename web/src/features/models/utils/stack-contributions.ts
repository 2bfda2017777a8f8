import { formatEigenvalue } from '../../../lib/format-number';
import type { ModalPart } from '../types';

export type StackedModes = {
  labels: string[];
  /** Each mode's own share of the chosen state, per sample. */
  parts: number[][];
  /** Running sums: layer i is modes 0 … i added up; the last layer is the free response itself. */
  layers: number[][];
};

/** One state's free response split into modes, stacked for a chart (signed shares stack as sums). */
export function stackModeContributions(modal: ModalPart[], stateIndex: number): StackedModes {
  const parts = modal.map((mode) => mode.contribution.map((row) => row[stateIndex]));
  const layers: number[][] = [];
  parts.forEach((part, i) => {
    layers.push(i === 0 ? [...part] : part.map((value, k) => value + layers[i - 1][k]));
  });
  const labels = modal.map((mode) => `λ = ${formatEigenvalue(mode.eigenvalue, 3)}`);
  return { labels, parts, layers };
}
