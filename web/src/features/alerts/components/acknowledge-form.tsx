import { useState } from 'react';
import { NoteField } from '../../../components/ui/note-field';
import { useAlertAction } from '../api/use-alert-action';
import { serverErrors, topLevelField } from '../utils/server-errors';
import { FormError } from './form-error';
import { SubmitOrCancel } from '../../../components/ui/submit-or-cancel';

export function AcknowledgeForm({ alertId, onDone }: { alertId: string; onDone: () => void }) {
  const [note, setNote] = useState('');
  const acknowledge = useAlertAction(alertId, 'acknowledge');
  const errors = serverErrors(acknowledge.error, topLevelField(['note']));
  return (
    <form
      aria-label="Acknowledge the alert"
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        acknowledge.mutate({ note: note.trim() }, { onSuccess: onDone });
      }}
    >
      <p>Acknowledging says you have seen the alert and will look into it; escalation to the next person stops.</p>
      <NoteField label="Note (optional)" value={note} onChange={setNote} />
      <FormError message={errors.fields.note ?? errors.general} />
      <SubmitOrCancel label={'Acknowledge'} pending={acknowledge.isPending} onCancel={onDone} />
    </form>
  );
}
