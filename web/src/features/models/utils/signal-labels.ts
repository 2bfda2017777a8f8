import type { GridName } from './editor-state';

type Signal = { name: string; unit: string };
type LoopSignals = { inputs: Signal[]; states: Signal[]; outputs: Signal[] };

export function signalLabel(signal: Signal): string {
  return signal.unit ? `${signal.name} (${signal.unit})` : signal.name;
}

export type GridLabels = { rows: string[]; columns: string[] };

/** Row and column labels of every matrix, from the loop's signal names and units. */
export function gridLabels(loop: LoopSignals): Record<GridName, GridLabels> {
  const states = loop.states.map(signalLabel);
  const inputs = loop.inputs.map(signalLabel);
  const outputs = loop.outputs.map(signalLabel);
  return {
    A: { rows: states, columns: states },
    B: { rows: states, columns: inputs },
    C: { rows: outputs, columns: states },
    D: { rows: outputs, columns: inputs },
    Ac: { rows: states, columns: states },
    Bc: { rows: states, columns: inputs },
    Q: { rows: states, columns: states },
    R: { rows: outputs, columns: outputs },
  };
}

export const GRID_TITLES: Record<GridName, string> = {
  A: 'A — how each state carries into the next sample',
  B: 'B — how each input moves the states in one sample',
  C: 'C — which states the outputs measure',
  D: 'D — direct effect of the inputs on the outputs',
  Ac: 'Ac — continuous state matrix (per second)',
  Bc: 'Bc — continuous input matrix (per second)',
  Q: 'Q — process noise covariance (state units squared, per sample)',
  R: 'R — measurement noise covariance (output units squared)',
};
