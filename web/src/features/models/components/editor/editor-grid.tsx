import type { EditorAction, EditorState, GridName } from '../../utils/editor-state';
import { GRID_TITLES, type GridLabels } from '../../utils/signal-labels';
import { MatrixGrid } from './matrix-grid';

export type ServerCellProblem = { grid: string; row: number; column: number; message: string };

type EditorGridProps = {
  name: GridName;
  state: EditorState;
  labels: Record<GridName, GridLabels>;
  dispatch: (action: EditorAction) => void;
  serverCells: ServerCellProblem[];
};

export function EditorGrid({ name, state, labels, dispatch, serverCells }: EditorGridProps) {
  const grid = state.grids[name];
  return (
    <MatrixGrid
      name={name}
      title={`${GRID_TITLES[name]} · ${grid.length}×${grid[0]?.length ?? 0}`}
      rowLabels={labels[name].rows}
      columnLabels={labels[name].columns}
      grid={grid}
      onChange={(next) => dispatch({ type: 'grid', name, grid: next })}
      flagged={serverCells.filter((cell) => cell.grid === name)}
    />
  );
}
