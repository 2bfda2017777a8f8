import { useId, type KeyboardEvent } from 'react';
import type { Dimensions, EditorAction, EditorState, EntryWay, GridName } from '../../utils/editor-state';
import type { GridLabels } from '../../utils/signal-labels';
import type { UploadedModel } from '../../types';
import { EditorGrid, type ServerCellProblem } from './editor-grid';
import { OutputMatrices } from './output-matrices';
import { UploadPanel } from './upload-panel';

const WAYS: { way: EntryWay; label: string }[] = [
  { way: 'matrices', label: 'Matrix editor' },
  { way: 'upload', label: 'Upload files' },
  { way: 'continuous', label: 'Continuous model' },
];

type EntryWaysProps = {
  loopId: string;
  samplePeriodS: number;
  state: EditorState;
  dims: Dimensions;
  labels: Record<GridName, GridLabels>;
  dispatch: (action: EditorAction) => void;
  serverCells: ServerCellProblem[];
};

export function EntryWays({ loopId, samplePeriodS, state, dims, labels, dispatch, serverCells }: EntryWaysProps) {
  const baseId = useId();
  const grid = (name: GridName) => (
    <EditorGrid name={name} state={state} labels={labels} dispatch={dispatch} serverCells={serverCells} />
  );
  const outputs = (
    <OutputMatrices state={state} dims={dims} labels={labels} dispatch={dispatch} serverCells={serverCells} />
  );
  const onKeyDown = (event: KeyboardEvent<HTMLButtonElement>, index: number) => {
    if (event.key !== 'ArrowRight' && event.key !== 'ArrowLeft') return;
    const next = WAYS[(index + (event.key === 'ArrowRight' ? 1 : WAYS.length - 1)) % WAYS.length];
    dispatch({ type: 'way', way: next.way });
    document.getElementById(`${baseId}-${next.way}`)?.focus();
  };

  return (
    <div className="space-y-3">
      <div role="tablist" aria-label="Ways to enter the model" className="flex gap-1 border-b border-rule">
        {WAYS.map(({ way, label }, index) => (
          <button
            key={way}
            id={`${baseId}-${way}`}
            type="button"
            role="tab"
            aria-selected={state.way === way}
            aria-controls={`${baseId}-panel`}
            tabIndex={state.way === way ? 0 : -1}
            onClick={() => dispatch({ type: 'way', way })}
            onKeyDown={(event) => onKeyDown(event, index)}
            className={`-mb-px border-b-4 px-3 py-1.5 text-sm font-medium ${state.way === way ? 'border-b-twin font-bold' : 'border-b-transparent hover:border-b-rule'}`}
          >
            {label}
          </button>
        ))}
      </div>
      <div id={`${baseId}-panel`} role="tabpanel" aria-labelledby={`${baseId}-${state.way}`} className="space-y-4">
        {state.uploadNote ? (
          <p role="status" className="rounded-sm border-l-4 border-l-twin bg-panel px-3 py-2 text-sm">
            {state.uploadNote}
          </p>
        ) : null}
        {state.way === 'matrices' ? (
          <>
            <p className="max-w-3xl text-sm text-ink/75">
              Type the numbers, or copy a block from a spreadsheet and paste it into any cell: it fills from that cell
              to the right and down. Tab-, comma- and semicolon-separated text is read; a decimal comma is fine except
              in comma-separated text.
            </p>
            {grid('A')}
            {grid('B')}
            {outputs}
          </>
        ) : null}
        {state.way === 'upload' ? (
          <UploadPanel loopId={loopId} onRead={(model: UploadedModel) => dispatch({ type: 'uploaded', model })} />
        ) : null}
        {state.way === 'continuous' ? (
          <>
            <p className="max-w-3xl text-sm text-ink/75">
              Give dx/dt = Ac x + Bc u. On saving, Shadowloop samples it every {samplePeriodS} s (the loop&apos;s sample
              period) with the inputs held between samples (zero-order hold); the version shows both the continuous and
              the sampled matrices.
            </p>
            {grid('Ac')}
            {grid('Bc')}
            {outputs}
          </>
        ) : null}
      </div>
    </div>
  );
}
