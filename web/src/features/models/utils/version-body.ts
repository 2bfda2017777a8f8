import type { CreateModelVersionBody } from '../api/create-model-version';
import type { AnalysisRequest } from '../api/preview-analysis';
import { plural } from '../../../lib/format-number';
import { readGrid } from './matrix-cells';
import { gridShapes, type Dimensions, type EditorState, type GridName } from './editor-state';

export type EditorProblem = { grid: GridName | 'changeNote'; message: string };

/** The matrices the chosen source and toggles send, in the api's order. */
export function gridsToSend(state: EditorState): GridName[] {
  const main: GridName[] = state.source === 'continuous' ? ['Ac', 'Bc'] : ['A', 'B'];
  const output: GridName[] = [...(state.useC ? ['C' as const] : []), ...(state.useD ? ['D' as const] : [])];
  const noise: GridName[] = state.correction === 'kalman' ? ['Q', 'R'] : [];
  return [...main, ...output, ...noise];
}

/** Reads every grid that will be sent; one problem line per matrix that has empty or unreadable cells. */
export function readGrids(
  state: EditorState,
  dims: Dimensions,
): { matrices: Partial<Record<GridName, number[][]>>; problems: EditorProblem[] } {
  const shapes = gridShapes(dims);
  const matrices: Partial<Record<GridName, number[][]>> = {};
  const problems: EditorProblem[] = [];
  for (const name of gridsToSend(state)) {
    const grid = state.grids[name];
    const [rows, columns] = shapes[name];
    if (grid.length !== rows || grid.some((row) => row.length !== columns)) {
      problems.push({ grid: name, message: `${name} must be ${rows}×${columns} for this loop's signals.` });
      continue;
    }
    const read = readGrid(grid);
    if ('matrix' in read) matrices[name] = read.matrix;
    else {
      const empty = read.problems.filter((p) => p.message === 'empty').length;
      const wrong = read.problems.filter((p) => p.message !== 'empty');
      const parts = [
        empty ? `${plural(empty, 'cell')} empty` : '',
        ...wrong.slice(0, 3).map((p) => `row ${p.row + 1}, column ${p.column + 1}: ${p.message}`),
      ];
      problems.push({
        grid: name,
        message: `${name}: ${parts.filter(Boolean).join('; ')}${wrong.length > 3 ? ` and ${wrong.length - 3} more` : ''}.`,
      });
    }
  }
  return { matrices, problems };
}

export function buildVersionBody(
  state: EditorState,
  dims: Dimensions,
): { body: CreateModelVersionBody } | { problems: EditorProblem[] } {
  const { matrices, problems } = readGrids(state, dims);
  if (state.changeNote.trim() === '')
    problems.push({ grid: 'changeNote', message: 'Say what changed and why in the change note.' });
  if (problems.length > 0) return { problems };
  const { Q, R, ...model } = matrices;
  return {
    body: {
      source: state.source,
      ...model,
      correction: state.correction === 'kalman' ? { mode: 'kalman', Q, R } : { mode: state.correction },
      changeNote: state.changeNote.trim(),
    },
  };
}

/** What the live preview may analyse: sampled matrices that are complete; null otherwise. */
export function previewRequest(state: EditorState, dims: Dimensions, samplePeriodS: number): AnalysisRequest | null {
  if (state.source !== 'discrete') return null;
  const { matrices, problems } = readGrids({ ...state, correction: 'free_run' }, dims);
  if (problems.length > 0 || !matrices.A || !matrices.B) return null;
  return { A: matrices.A, B: matrices.B, C: matrices.C, D: matrices.D, samplePeriodS, stepSamples: 100 };
}
