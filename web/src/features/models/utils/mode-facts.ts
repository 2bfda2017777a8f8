import type { Mode } from '../types';

/** Distance from the unit circle treated as on it; the same default as the engine's analysis. */
export const ON_CIRCLE_TOLERANCE = 1e-6;

/** Above this eigenvector condition number the modes are called ill-conditioned. */
export const ILL_CONDITIONED_CONDITION = 1e3;

export function isDivergent(mode: Mode): boolean {
  return mode.magnitude > 1 + ON_CIRCLE_TOLERANCE;
}

export function isOnUnitCircle(mode: Mode): boolean {
  return Math.abs(mode.magnitude - 1) <= ON_CIRCLE_TOLERANCE;
}

export function isOscillating(mode: Mode): boolean {
  return mode.periodSamples !== null;
}

/** Settling time to about 2 % of the start: four time constants. */
export function settlingTimeS(mode: Mode): number | null {
  return mode.timeConstantS === null ? null : 4 * mode.timeConstantS;
}

/** One entry per conjugate pair (the member with positive imaginary part), order kept. */
export function distinctModes(modes: readonly Mode[]): Mode[] {
  return modes.filter((mode) => mode.eigenvalue.im >= 0);
}

export function isPair(mode: Mode): boolean {
  return Math.abs(mode.eigenvalue.im) > 0;
}
