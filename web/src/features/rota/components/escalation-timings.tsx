import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { Button } from '../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import { formatDuration } from '../../../lib/format-number';
import { alertSettingsQueryOptions, type AlertSettings } from '../../alerts/api/get-alert-settings';
import { useUpdateAlertSettings } from '../../alerts/api/update-alert-settings';
import { FormError } from '../../alerts/components/form-error';
import { serverErrors, topLevelField } from '../../alerts/utils/server-errors';
import { readSettings, SETTING_FIELDS, settingsText, type SettingsText } from '../utils/settings-form';
import { SubmitOrCancel } from '../../../components/ui/submit-or-cancel';

const minutes = (m: number) => formatDuration(m * 60);

function TimingSentences({ settings }: { settings: AlertSettings }) {
  return (
    <ul className="list-disc space-y-1 pl-5 text-sm">
      <li>
        An alert nobody acknowledges goes to the secondary on call after {minutes(settings.secondaryAfterMin)}, and to
        the area&apos;s engineers after {minutes(settings.areaAfterMin)}.
      </li>
      <li>The acknowledge link in an alert e-mail works once, for {minutes(settings.ackLinkTtlMin)}.</li>
      <li>An alert can be shelved for at most {formatDuration(settings.shelveMaxHours * 3600)}.</li>
      <li>
        Alert-load targets: {settings.targetPerDay} alerts a day, {settings.targetPer10Min} per 10 minutes; more than{' '}
        {settings.floodPer10Min} in 10 minutes is a flood.
      </li>
    </ul>
  );
}

function SettingsForm({ settings, onDone }: { settings: AlertSettings; onDone: () => void }) {
  const [text, setText] = useState<SettingsText>(() => settingsText(settings));
  const [problems, setProblems] = useState<Partial<SettingsText>>({});
  const update = useUpdateAlertSettings();
  const server = serverErrors(update.error, topLevelField(SETTING_FIELDS.map((f) => f.key)));
  const submit = () => {
    const result = readSettings(text);
    setProblems(result.problems ?? {});
    if (result.settings) update.mutate(result.settings, { onSuccess: onDone });
  };
  return (
    <form
      aria-label="Escalation timings and targets"
      noValidate
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {SETTING_FIELDS.map(({ key, label, unit }) => (
          <Field key={key} label={`${label} (${unit})`} error={problems[key] ?? server.fields[key]}>
            {({ inputId, describedBy, invalid }) => (
              <input
                id={inputId}
                inputMode="numeric"
                aria-describedby={describedBy}
                aria-invalid={invalid}
                value={text[key]}
                onChange={(e) => setText((old) => ({ ...old, [key]: e.target.value }))}
                className={`w-28 ${INPUT_CLASSES}`}
              />
            )}
          </Field>
        ))}
      </div>
      <FormError message={server.general} />
      <SubmitOrCancel label={'Save the timings'} pending={update.isPending} onCancel={onDone} />
    </form>
  );
}

/** The escalation timings and alert-load targets; administrators change them in place. */
export function EscalationTimings({ mayEdit }: { mayEdit: boolean }) {
  const settings = useQuery(alertSettingsQueryOptions());
  const [editing, setEditing] = useState(false);
  if (settings.isError) return <ErrorNotice error={settings.error} onRetry={() => void settings.refetch()} />;
  if (!settings.data) return <p role="status" className="h-16 animate-pulse rounded-sm bg-rule/40" />;
  if (editing) return <SettingsForm settings={settings.data} onDone={() => setEditing(false)} />;
  return (
    <div className="space-y-2">
      <TimingSentences settings={settings.data} />
      {mayEdit ? (
        <Button onClick={() => setEditing(true)}>Change the timings</Button>
      ) : (
        <p className="text-xs text-ink/70">Administrators change these.</p>
      )}
    </div>
  );
}
