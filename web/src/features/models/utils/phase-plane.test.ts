import { describe, expect, it } from 'vitest';
import type { Mode } from '../types';
import { eigenDirections, phaseExtent } from './phase-plane';

const mode = (re: number, im = 0) => ({ eigenvalue: { re, im } }) as Mode;

describe('phase plane', () => {
  it('finds the eigenvector directions of a 2×2 A without a mode split', () => {
    const A = [
      [0.9, 0.1],
      [0, 0.5],
    ];
    const directions = eigenDirections(A, [mode(0.9), mode(0.5)], null);
    expect(directions.map((d) => d.label)).toEqual(['λ = 0.9', 'λ = 0.5']);
    const [slow, fast] = directions;
    expect(Math.abs(slow.dy)).toBeCloseTo(0, 12);
    for (const { dx, dy } of directions) expect(Math.hypot(dx, dy)).toBeCloseTo(1, 12);
    // A v = λ v for the fast direction
    const Av = [A[0][0] * fast.dx + A[0][1] * fast.dy, A[1][0] * fast.dx + A[1][1] * fast.dy];
    expect(Av[0]).toBeCloseTo(0.5 * fast.dx, 12);
    expect(Av[1]).toBeCloseTo(0.5 * fast.dy, 12);
  });

  it('draws no direction for a complex pair', () => {
    expect(
      eigenDirections(
        [
          [0, -1],
          [1, 0],
        ],
        [mode(0, 1), mode(0, -1)],
        null,
      ),
    ).toEqual([]);
  });

  it('sizes the plot to hold the trajectory with a margin', () => {
    expect(
      phaseExtent([
        [1, -2],
        [0.5, 4],
      ]),
    ).toEqual([1.15, 4.6]);
  });
});
