import { CORRECTION_WORDS } from '../correction-words';
import type { CorrectionMode } from '../../types';
import type { EditorAction, EditorState, GridName } from '../../utils/editor-state';
import type { GridLabels } from '../../utils/signal-labels';
import { EditorGrid, type ServerCellProblem } from './editor-grid';

const MODES: CorrectionMode[] = ['free_run', 'reset', 'kalman'];

type CorrectionSettingsProps = {
  state: EditorState;
  labels: Record<GridName, GridLabels>;
  dispatch: (action: EditorAction) => void;
  serverCells: ServerCellProblem[];
};

export function CorrectionSettings({ state, labels, dispatch, serverCells }: CorrectionSettingsProps) {
  return (
    <fieldset className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3 text-sm">
      <legend className="px-1 font-bold">Correction: how the twin uses each new measurement</legend>
      <div className="space-y-1.5">
        {MODES.map((mode) => (
          <label key={mode} className="flex items-start gap-2">
            <input
              type="radio"
              name="correction"
              className="mt-1 accent-ink"
              checked={state.correction === mode}
              onChange={() => dispatch({ type: 'correction', mode })}
            />
            <span>
              <strong>{CORRECTION_WORDS[mode].name}.</strong> {CORRECTION_WORDS[mode].explanation}
            </span>
          </label>
        ))}
      </div>
      {state.correction === 'kalman' ? (
        <div className="space-y-3">
          <p className="text-ink/75">
            The starting values are small and diagonal. Set Q from how much the process wanders in one sample and R from
            the transmitters&apos; noise; the gain K is computed when you save and shown on the version.
          </p>
          <div className="flex flex-wrap gap-6">
            <EditorGrid name="Q" state={state} labels={labels} dispatch={dispatch} serverCells={serverCells} />
            <EditorGrid name="R" state={state} labels={labels} dispatch={dispatch} serverCells={serverCells} />
          </div>
        </div>
      ) : null}
    </fieldset>
  );
}
