import type { Shift } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import { FormError } from '../../alerts/components/form-error';
import { serverErrors, topLevelField } from '../../alerts/utils/server-errors';
import type { Area } from '../../loops/api/get-areas';
import type { Person } from '../api/get-people';
import { createShift, updateShift, useRotaChange, type SaveShiftBody } from '../api/shift-changes';
import { shiftBody, type ShiftFormProblems, type ShiftFormValues } from '../utils/shift-form';
import { SubmitOrCancel } from '../../../components/ui/submit-or-cancel';

const FIELDS = ['userId', 'area', 'position', 'startsAt', 'endsAt', 'note'] as const;

type ShiftFormProps = {
  shift: Shift | null;
  initial: ShiftFormValues;
  people: Person[];
  areas: Area[];
  timeZone: string;
  onDone: () => void;
};

export function ShiftForm({ shift, initial, people, areas, timeZone, onDone }: ShiftFormProps) {
  const [values, setValues] = useState(initial);
  const [problems, setProblems] = useState<ShiftFormProblems>({});
  const save = useRotaChange((body: SaveShiftBody) => (shift ? updateShift(shift.id, body) : createShift(body)));
  const server = serverErrors(save.error, topLevelField(FIELDS));
  const set = (patch: Partial<ShiftFormValues>) => setValues((old) => ({ ...old, ...patch }));
  const problem = (field: keyof ShiftFormValues) => problems[field] ?? server.fields[field];

  const submit = () => {
    const result = shiftBody(values, timeZone);
    setProblems(result.problems ?? {});
    if (result.body) save.mutate(result.body, { onSuccess: onDone });
  };

  return (
    <form
      aria-label={shift ? 'Change the shift' : 'Add a shift'}
      noValidate
      className="grid gap-3 sm:grid-cols-2"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <Field label="Person" error={problem('userId')}>
        {({ inputId, describedBy, invalid }) => (
          <select
            id={inputId}
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={values.userId}
            onChange={(e) => set({ userId: e.target.value })}
            className={INPUT_CLASSES}
          >
            <option value="">Choose…</option>
            {people.map((person) => (
              <option key={person.id} value={person.id}>
                {person.name}
              </option>
            ))}
          </select>
        )}
      </Field>
      <Field label="Area" error={problem('area')}>
        {({ inputId, describedBy, invalid }) => (
          <select
            id={inputId}
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={values.area}
            onChange={(e) => set({ area: e.target.value })}
            className={INPUT_CLASSES}
          >
            <option value="">Plant-wide</option>
            {areas.map((area) => (
              <option key={area.id} value={area.id}>
                {area.name}
              </option>
            ))}
          </select>
        )}
      </Field>
      <fieldset className="text-sm sm:col-span-2">
        <legend className="font-medium">Position</legend>
        <div className="mt-1 flex gap-4">
          {(['primary', 'secondary'] as const).map((position) => (
            <label key={position} className="inline-flex items-center gap-1.5">
              <input
                type="radio"
                name="position"
                checked={values.position === position}
                onChange={() => set({ position })}
              />
              {position === 'primary'
                ? 'Primary — called first'
                : 'Secondary — called when the primary does not acknowledge'}
            </label>
          ))}
        </div>
        {problem('position') ? <p className="text-xs font-medium text-diverged">{problem('position')}</p> : null}
      </fieldset>
      <Field label="Starts" hint={`Plant time (${timeZone}).`} error={problem('startsAt')}>
        {({ inputId, describedBy, invalid }) => (
          <input
            id={inputId}
            type="datetime-local"
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={values.startsAt}
            onChange={(e) => set({ startsAt: e.target.value })}
            className={INPUT_CLASSES}
          />
        )}
      </Field>
      <Field label="Ends" hint={`Plant time (${timeZone}).`} error={problem('endsAt')}>
        {({ inputId, describedBy, invalid }) => (
          <input
            id={inputId}
            type="datetime-local"
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={values.endsAt}
            onChange={(e) => set({ endsAt: e.target.value })}
            className={INPUT_CLASSES}
          />
        )}
      </Field>
      <Field label="Note (optional)" className="sm:col-span-2" error={problem('note')}>
        {({ inputId, describedBy, invalid }) => (
          <input
            id={inputId}
            aria-describedby={describedBy}
            aria-invalid={invalid}
            value={values.note}
            onChange={(e) => set({ note: e.target.value })}
            className={INPUT_CLASSES}
          />
        )}
      </Field>
      <div className="space-y-2 sm:col-span-2">
        <FormError message={server.general} />
        <SubmitOrCancel label={shift ? 'Save the shift' : 'Add the shift'} pending={save.isPending} onCancel={onDone} />
      </div>
    </form>
  );
}
