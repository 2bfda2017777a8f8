import { useQuery } from '@tanstack/react-query';
import { NoteField } from '../../../components/ui/note-field';
import { useState } from 'react';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import { formatDuration } from '../../../lib/format-number';
import { fromPlantWallTime, toPlantWallTime } from '../../../lib/plant-time';
import { alertSettingsQueryOptions } from '../api/get-alert-settings';
import { useAlertAction } from '../api/use-alert-action';
import { serverErrors, topLevelField } from '../utils/server-errors';
import { defaultShelveHours, shelveUntilProblem } from '../utils/shelve-limits';
import { FormError } from './form-error';
import { SubmitOrCancel } from '../../../components/ui/submit-or-cancel';

type ShelveFormProps = { alertId: string; timeZone: string; onDone: () => void };

/** Used while the site's limit is not known yet; the server checks the real one. */
const FALLBACK_MAX_HOURS = 24;

export function ShelveForm({ alertId, timeZone, onDone }: ShelveFormProps) {
  const settings = useQuery(alertSettingsQueryOptions());
  const maxHours = settings.data?.shelveMaxHours ?? FALLBACK_MAX_HOURS;
  const [until, setUntil] = useState(() =>
    toPlantWallTime(Date.now() + defaultShelveHours(maxHours) * 3_600_000, timeZone),
  );
  const [reason, setReason] = useState('');
  const [problems, setProblems] = useState<{ until?: string; note?: string }>({});
  const shelve = useAlertAction(alertId, 'shelve');
  const server = serverErrors(shelve.error, topLevelField(['note', 'until']));

  const submit = () => {
    const untilMs = fromPlantWallTime(until, timeZone);
    const found = {
      until: shelveUntilProblem(untilMs, Date.now(), maxHours, timeZone) ?? undefined,
      note: reason.trim() ? undefined : 'Say why the alert is shelved.',
    };
    setProblems(found);
    if (found.until || found.note) return;
    shelve.mutate({ note: reason.trim(), until: new Date(untilMs).toISOString() }, { onSuccess: onDone });
  };

  return (
    <form
      aria-label="Shelve the alert"
      noValidate
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <p>
        A shelved alert calls nobody until the shelf ends; then it comes back by itself if its condition is still there.
        The site allows at most {formatDuration(maxHours * 3600)}.
      </p>
      <Field label="Shelved until" hint={`Plant time (${timeZone}).`} error={problems.until ?? server.fields.until}>
        {({ inputId, describedBy, invalid }) => (
          <input
            id={inputId}
            type="datetime-local"
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={until}
            onChange={(e) => setUntil(e.target.value)}
            className={`w-60 ${INPUT_CLASSES}`}
          />
        )}
      </Field>
      <NoteField
        rows={3}
        label="Reason"
        hint="Who reads the timeline later should understand why nobody was called."
        value={reason}
        onChange={setReason}
        error={problems.note ?? server.fields.note}
      />
      <FormError message={server.general} />
      <SubmitOrCancel label={'Shelve'} pending={shelve.isPending} onCancel={onDone} />
    </form>
  );
}
