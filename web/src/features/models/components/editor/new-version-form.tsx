import { useMemo, useReducer, useState } from 'react';
import { useNavigate } from 'react-router';
import { Button } from '../../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../../components/ui/field';
import type { Loop } from '../../../loops/api/get-loops';
import { useCreateModelVersion } from '../../api/create-model-version';
import type { Version } from '../../types';
import { editorReducer, initialEditorState } from '../../utils/editor-state';
import { serverModelProblems } from '../../utils/server-model-problems';
import { gridLabels } from '../../utils/signal-labels';
import { buildVersionBody, previewRequest, type EditorProblem } from '../../utils/version-body';
import { CorrectionSettings } from './correction-settings';
import { EntryWays } from './entry-ways';
import { SaveProblems } from './save-problems';
import { VerdictPreview } from './verdict-preview';

export function NewVersionForm({ loop, from }: { loop: Loop; from?: Version }) {
  const dims = useMemo(
    () => ({ states: loop.states.length, inputs: loop.inputs.length, outputs: loop.outputs.length }),
    [loop],
  );
  const [state, dispatch] = useReducer(editorReducer, undefined, () => initialEditorState(dims, from));
  const labels = useMemo(() => gridLabels(loop), [loop]);
  const [problems, setProblems] = useState<EditorProblem[]>([]);
  const create = useCreateModelVersion(loop.id);
  const navigate = useNavigate();
  const server = serverModelProblems(create.error);

  const save = () => {
    const built = buildVersionBody(state, dims);
    if ('problems' in built) return setProblems(built.problems);
    setProblems([]);
    create.mutate(built.body, { onSuccess: (version) => void navigate(`/models/versions/${version.id}`) });
  };

  return (
    <div className="space-y-5">
      <EntryWays
        loopId={loop.id}
        samplePeriodS={loop.samplePeriodS}
        state={state}
        dims={dims}
        labels={labels}
        dispatch={dispatch}
        serverCells={server.cells}
      />
      <VerdictPreview
        request={previewRequest(state, dims, loop.samplePeriodS)}
        continuous={state.source === 'continuous'}
      />
      <CorrectionSettings state={state} labels={labels} dispatch={dispatch} serverCells={server.cells} />
      <Field
        label="Change note"
        hint="What changed and why, and where the numbers come from. The reviewer reads this first."
        error={problems.find((p) => p.grid === 'changeNote')?.message}
      >
        {({ inputId, describedBy, invalid }) => (
          <textarea
            id={inputId}
            rows={3}
            aria-describedby={describedBy}
            aria-invalid={invalid || undefined}
            value={state.changeNote}
            onChange={(event) => dispatch({ type: 'note', text: event.target.value })}
            className={`w-full max-w-3xl ${INPUT_CLASSES}`}
          />
        )}
      </Field>
      <SaveProblems problems={problems.filter((p) => p.grid !== 'changeNote')} server={server} error={create.error} />
      <div className="flex items-center gap-3">
        <Button variant="primary" onClick={save} disabled={create.isPending}>
          {create.isPending ? 'Saving…' : 'Save as draft'}
        </Button>
        <span className="text-sm text-ink/70">
          A draft can be changed by saving a new one; it reaches the twin only after review and activation.
        </span>
      </div>
    </div>
  );
}
