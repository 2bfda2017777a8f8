import { formatEigenvalue } from '../../../lib/format-number';
import type { ModalPart, Mode } from '../types';

export type Direction = { label: string; dx: number; dy: number };

function unit(dx: number, dy: number): [number, number] | null {
  const length = Math.hypot(dx, dy);
  return length > 1e-12 ? [dx / length, dy / length] : null;
}

/**
 * Eigenvector directions of a 2×2 A for its real eigenvalues: from the mode split when the server
 * sent one, else from a row of A − λI (the eigenvector is orthogonal to it).
 */
export function eigenDirections(A: number[][], modes: Mode[], modal: ModalPart[] | null): Direction[] {
  const real = modes.filter((mode) => Math.abs(mode.eigenvalue.im) < 1e-12);
  return real.flatMap((mode) => {
    const label = `λ = ${formatEigenvalue(mode.eigenvalue, 3)}`;
    const fromModal = modal?.find(
      (part) => !part.conjugatePair && Math.abs(part.eigenvalue.re - mode.eigenvalue.re) < 1e-9,
    );
    const lambda = mode.eigenvalue.re;
    const candidates: [number, number][] = fromModal
      ? [[fromModal.eigenvector[0].re, fromModal.eigenvector[1].re]]
      : [
          [A[0][1], lambda - A[0][0]],
          [lambda - A[1][1], A[1][0]],
        ];
    const picked = candidates.map(([dx, dy]) => unit(dx, dy)).find((u) => u !== null);
    return picked ? [{ label, dx: picked[0], dy: picked[1] }] : [];
  });
}

/** Half-widths of the plot around the operating point that hold the whole trajectory. */
export function phaseExtent(trajectory: number[][]): [number, number] {
  const reach = (index: number) => Math.max(1e-9, ...trajectory.map((x) => Math.abs(x[index]))) * 1.15;
  return [reach(0), reach(1)];
}
