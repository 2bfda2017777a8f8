import type { Mode } from '../types';

/** The square of the complex plane a plot shows: its centre and half its width. */
export type PlaneView = { centreRe: number; centreIm: number; half: number };

type ModeSets = { modes: Mode[] }[];

/** The whole unit circle with a margin, widened to hold every eigenvalue. */
export function wholePlaneView(sets: ModeSets): PlaneView {
  const largest = Math.max(0, ...sets.flatMap((set) => set.modes.map((mode) => mode.magnitude)));
  return { centreRe: 0, centreIm: 0, half: Math.max(1.2, largest * 1.1) };
}

/** Close around the eigenvalues, for models whose modes crowd together (often just inside 1). */
export function zoomedPlaneView(sets: ModeSets): PlaneView {
  const values = sets.flatMap((set) => set.modes.map((mode) => mode.eigenvalue));
  const re = values.map((v) => v.re);
  const im = values.map((v) => v.im);
  const [reMin, reMax, imMin, imMax] = [Math.min(...re), Math.max(...re), Math.min(...im), Math.max(...im)];
  const span = Math.max(reMax - reMin, imMax - imMin, 0.02);
  return { centreRe: (reMin + reMax) / 2, centreIm: (imMin + imMax) / 2, half: (span / 2) * 1.4 };
}

/** Zooming helps when the eigenvalues fill less than a quarter of the whole view. */
export function zoomHelps(sets: ModeSets): boolean {
  return sets.some((set) => set.modes.length > 0) && zoomedPlaneView(sets).half < wholePlaneView(sets).half / 4;
}
