import { describe, expect, it } from 'vitest';
import type { Mode } from '../types';
import { wholePlaneView, zoomedPlaneView, zoomHelps } from './plane-view';

const modes = (...values: [number, number][]) =>
  values.map(([re, im]) => ({ eigenvalue: { re, im }, magnitude: Math.hypot(re, im) }) as Mode);

describe('eigenvalue plane views', () => {
  it('shows the whole unit circle, widened for an eigenvalue outside it', () => {
    expect(wholePlaneView([{ modes: modes([0.5, 0]) }]).half).toBe(1.2);
    expect(wholePlaneView([{ modes: modes([2, 0]) }]).half).toBeCloseTo(2.2, 12);
  });

  it('offers a close view when the eigenvalues crowd together', () => {
    const crowded = [{ modes: modes([0.997, 0], [0.988, 0], [0.95, 0]) }];
    expect(zoomHelps(crowded)).toBe(true);
    const view = zoomedPlaneView(crowded);
    expect(view.centreRe).toBeCloseTo(0.9735, 12);
    expect(view.half).toBeCloseTo(0.0329, 12);
    expect(zoomHelps([{ modes: modes([0.9, 0], [-0.5, 0.3], [-0.5, -0.3]) }])).toBe(false);
  });
});
