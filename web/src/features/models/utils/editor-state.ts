import type { CorrectionMode, UploadedModel, Version } from '../types';
import { emptyGrid, gridFromMatrix, identityGrid, type CellGrid } from './matrix-cells';

export type GridName = 'A' | 'B' | 'C' | 'D' | 'Ac' | 'Bc' | 'Q' | 'R';

export type EntryWay = 'matrices' | 'upload' | 'continuous';

export type Dimensions = { states: number; inputs: number; outputs: number };

export type EditorState = {
  way: EntryWay;
  /** Which matrices are saved: the sampled A, B or the continuous Ac, Bc. */
  source: 'discrete' | 'continuous';
  grids: Record<GridName, CellGrid>;
  useC: boolean;
  useD: boolean;
  correction: CorrectionMode;
  changeNote: string;
  /** What the last upload filled in, until the engineer moves on. */
  uploadNote: string | null;
};

export type EditorAction =
  | { type: 'way'; way: EntryWay }
  | { type: 'grid'; name: GridName; grid: CellGrid }
  | { type: 'use'; which: 'useC' | 'useD'; on: boolean }
  | { type: 'correction'; mode: CorrectionMode }
  | { type: 'note'; text: string }
  | { type: 'uploaded'; model: UploadedModel };

/** Without C every state is an output, so C is required whenever the counts differ. */
export function needsC(dims: Dimensions): boolean {
  return dims.outputs !== dims.states;
}

export function gridShapes(dims: Dimensions): Record<GridName, [number, number]> {
  const { states: n, inputs: m, outputs: p } = dims;
  return { A: [n, n], B: [n, m], C: [p, n], D: [p, m], Ac: [n, n], Bc: [n, m], Q: [n, n], R: [p, p] };
}

/** A fresh editor sized from the loop's signals, or prefilled from an earlier version. */
export function initialEditorState(dims: Dimensions, from?: Version): EditorState {
  const shapes = gridShapes(dims);
  const sized = (name: GridName, matrix: number[][] | null | undefined, fallback: CellGrid) =>
    matrix ? gridFromMatrix(matrix, ...shapes[name]) : fallback;
  const continuous = from?.continuous ?? null;
  return {
    way: continuous ? 'continuous' : 'matrices',
    source: continuous ? 'continuous' : 'discrete',
    grids: {
      A: sized('A', from?.A, emptyGrid(...shapes.A)),
      B: sized('B', from?.B, emptyGrid(...shapes.B)),
      C: sized('C', from?.C, emptyGrid(...shapes.C)),
      D: sized('D', from?.D, emptyGrid(...shapes.D, '0')),
      Ac: sized('Ac', continuous?.Ac, emptyGrid(...shapes.Ac)),
      Bc: sized('Bc', continuous?.Bc, emptyGrid(...shapes.Bc)),
      Q: sized('Q', from?.correction.Q, identityGrid(dims.states, '0.01')),
      R: sized('R', from?.correction.R, identityGrid(dims.outputs, '0.1')),
    },
    useC: needsC(dims) || Boolean(from?.C),
    useD: Boolean(from?.D),
    correction: from?.correction.mode ?? 'free_run',
    changeNote: '',
    uploadNote: null,
  };
}

export function editorReducer(state: EditorState, action: EditorAction): EditorState {
  switch (action.type) {
    case 'way':
      if (action.way === 'upload') return { ...state, way: 'upload', uploadNote: null };
      return {
        ...state,
        way: action.way,
        source: action.way === 'continuous' ? 'continuous' : 'discrete',
        uploadNote: null,
      };
    case 'grid':
      return { ...state, grids: { ...state.grids, [action.name]: action.grid } };
    case 'use':
      return { ...state, [action.which]: action.on };
    case 'correction':
      return { ...state, correction: action.mode };
    case 'note':
      return { ...state, changeNote: action.text };
    case 'uploaded':
      return withUploaded(state, action.model);
  }
}

function withUploaded(state: EditorState, model: UploadedModel): EditorState {
  const grids = { ...state.grids };
  const names: GridName[] = model.source === 'continuous' ? ['Ac', 'Bc', 'C', 'D'] : ['A', 'B', 'C', 'D'];
  const filled = names.filter((name) => Boolean(model[name as keyof UploadedModel]));
  for (const name of filled)
    grids[name] = (model[name as keyof UploadedModel] as number[][]).map((row) => row.map(String));
  return {
    ...state,
    grids,
    way: model.source === 'continuous' ? 'continuous' : 'matrices',
    source: model.source,
    useC: state.useC || Boolean(model.C),
    useD: state.useD || Boolean(model.D),
    uploadNote: `Filled ${filled.join(', ')} from the uploaded files. Check them below, then save.`,
  };
}
