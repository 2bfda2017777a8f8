import type { CloseCause } from '@shadowloop/api/contracts';
import { NoteField } from '../../../components/ui/note-field';
import { useState } from 'react';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import { useAlertAction } from '../api/use-alert-action';
import { CLOSE_CAUSE_LABELS } from '../utils/alert-words';
import { serverErrors, topLevelField } from '../utils/server-errors';
import { FormError } from './form-error';
import { SubmitOrCancel } from '../../../components/ui/submit-or-cancel';

const CAUSES = Object.entries(CLOSE_CAUSE_LABELS) as [CloseCause, string][];

export function CloseForm({ alertId, onDone }: { alertId: string; onDone: () => void }) {
  const [cause, setCause] = useState<CloseCause | ''>('');
  const [note, setNote] = useState('');
  const [problems, setProblems] = useState<{ cause?: string; note?: string }>({});
  const close = useAlertAction(alertId, 'close');
  const server = serverErrors(close.error, topLevelField(['cause', 'note']));

  const submit = () => {
    const found = {
      cause: cause ? undefined : 'Choose what caused the alert.',
      note: note.trim() ? undefined : 'Say what was found or done.',
    };
    setProblems(found);
    if (!cause || found.note) return;
    close.mutate({ cause, note: note.trim() }, { onSuccess: onDone });
  };

  return (
    <form
      aria-label="Close the alert"
      noValidate
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <p>Closing ends the alert for good. A new alert is raised if the condition comes back later.</p>
      <Field label="Cause" error={problems.cause ?? server.fields.cause}>
        {({ inputId, describedBy, invalid }) => (
          <select
            id={inputId}
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={cause}
            onChange={(e) => setCause(e.target.value as CloseCause | '')}
            className={INPUT_CLASSES}
          >
            <option value="">Choose the cause…</option>
            {CAUSES.map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        )}
      </Field>
      <NoteField
        rows={3}
        label="Note"
        hint="What was found, and what was done about it."
        value={note}
        onChange={setNote}
        error={problems.note ?? server.fields.note}
      />
      <FormError message={server.general} />
      <SubmitOrCancel label={'Close the alert'} pending={close.isPending} onCancel={onDone} />
    </form>
  );
}
