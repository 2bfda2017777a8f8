import { plural } from '../../../../lib/format-number';
import type { Dimensions, EditorAction, EditorState, GridName } from '../../utils/editor-state';
import { needsC } from '../../utils/editor-state';
import type { GridLabels } from '../../utils/signal-labels';
import { EditorGrid, type ServerCellProblem } from './editor-grid';

type OutputMatricesProps = {
  state: EditorState;
  dims: Dimensions;
  labels: Record<GridName, GridLabels>;
  dispatch: (action: EditorAction) => void;
  serverCells: ServerCellProblem[];
};

/** C and D: shared by the sampled and the continuous way in, since sampling leaves them as they are. */
export function OutputMatrices({ state, dims, labels, dispatch, serverCells }: OutputMatricesProps) {
  const cRequired = needsC(dims);
  return (
    <div className="space-y-3">
      <label className="flex items-start gap-2 text-sm">
        <input
          type="checkbox"
          className="mt-0.5 size-4 accent-ink"
          checked={state.useC}
          disabled={cRequired}
          onChange={(event) => dispatch({ type: 'use', which: 'useC', on: event.target.checked })}
        />
        <span>
          Give C (the output matrix).{' '}
          <span className="text-ink/70">
            {cRequired
              ? `Needed: the loop has ${plural(dims.outputs, 'output')} and ${plural(dims.states, 'state')}.`
              : 'Without C, output i is state i.'}
          </span>
        </span>
      </label>
      {state.useC ? (
        <EditorGrid name="C" state={state} labels={labels} dispatch={dispatch} serverCells={serverCells} />
      ) : null}
      <label className="flex items-start gap-2 text-sm">
        <input
          type="checkbox"
          className="mt-0.5 size-4 accent-ink"
          checked={state.useD}
          onChange={(event) => dispatch({ type: 'use', which: 'useD', on: event.target.checked })}
        />
        <span>
          Give D (a direct effect of the inputs on the outputs).{' '}
          <span className="text-ink/70">Without D there is none.</span>
        </span>
      </label>
      {state.useD ? (
        <EditorGrid name="D" state={state} labels={labels} dispatch={dispatch} serverCells={serverCells} />
      ) : null}
    </div>
  );
}
