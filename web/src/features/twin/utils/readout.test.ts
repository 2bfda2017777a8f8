import { describe, expect, it } from 'vitest';
import type { AlignedRows } from './live-trend';
import { readoutAt } from './readout';

const LAYOUT = { outputs: 1, inputs: 1 };
// columns: measured, predicted, residual, input
const ROWS: AlignedRows = [
  [10, 20, 30],
  [1, 2, null],
  [1.1, 2.1, 3.1],
  [-0.1, -0.1, null],
  [50, null, null],
];
const overlays = { bands: [], forecast: { t: [40, 50], y: [[4, 5]] }, preview: null };

describe('the readout under the charts', () => {
  it('gives the newest row when nothing is pointed at, carrying the inputs on', () => {
    const readout = readoutAt(ROWS, LAYOUT, overlays, null);
    expect(readout?.t).toBe(30);
    expect(readout?.outputs[0]).toMatchObject({ measured: null, predicted: 3.1 });
    expect(readout?.inputs).toEqual([50]);
  });

  it('gives the row at or before the pointer, and the model alone ahead of now', () => {
    expect(readoutAt(ROWS, LAYOUT, overlays, 25)?.outputs[0].measured).toBe(2);
    const ahead = readoutAt(ROWS, LAYOUT, overlays, 50);
    expect(ahead?.outputs[0]).toEqual({ measured: null, predicted: null, residual: null, forecast: 5, preview: null });
  });
});
