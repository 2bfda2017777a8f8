import { useForm } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import type { CreateLoopBody } from '../api/create-loop';
import type { Area } from '../api/get-areas';
import { loopBody, SIGNAL_GROUPS, type LoopFormValues } from '../utils/loop-form-values';
import { serverProblems } from '../utils/server-field-errors';
import { loopFormResolver } from '../utils/validate-loop-form';
import { SignalRows } from './signal-rows';
import { TimeZoneField } from './time-zone-field';

type LoopFormProps = {
  initial: LoopFormValues;
  areas: Area[];
  submitLabel: string;
  /** A 409 from the server belongs to this field (the tag, when registering). */
  conflictField?: 'tag';
  onSave: (body: CreateLoopBody) => Promise<unknown>;
};

export function LoopForm({ initial, areas, submitLabel, conflictField, onSave }: LoopFormProps) {
  const form = useForm<LoopFormValues>({ defaultValues: initial, resolver: loopFormResolver, mode: 'onTouched' });
  const { register, control, handleSubmit, setError, formState } = form;
  const { errors } = formState;

  const submit = handleSubmit(async (values) => {
    try {
      await onSave(loopBody(values));
    } catch (error) {
      const { fields, general } = serverProblems(error, conflictField);
      for (const field of fields)
        setError(field.path as keyof LoopFormValues, { type: 'server', message: field.message });
      if (general.length > 0) setError('root.server', { type: 'server', message: general.join(' ') });
    }
  });

  const text = (name: 'tag' | 'name' | 'samplePeriodS', label: string, hint?: string, width = 'w-64') => (
    <Field label={label} hint={hint} error={errors[name]?.message}>
      {({ inputId, describedBy, invalid }) => (
        <input
          id={inputId}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={`${width} ${INPUT_CLASSES}`}
          {...register(name)}
        />
      )}
    </Field>
  );

  return (
    <form onSubmit={submit} noValidate className="max-w-4xl space-y-4">
      <div className="flex flex-wrap gap-4">
        {text('tag', 'Tag', 'The loop’s tag in the plant, e.g. AER-DO-101.', 'w-48')}
        {text('name', 'Name', undefined, 'w-80')}
        <Field label="Area" error={errors.area?.message}>
          {({ inputId, describedBy, invalid }) => (
            <select
              id={inputId}
              aria-describedby={describedBy}
              aria-invalid={invalid || undefined}
              className={INPUT_CLASSES}
              {...register('area')}
            >
              <option value="">Pick an area…</option>
              {areas.map((area) => (
                <option key={area.id} value={area.id}>
                  {area.name}
                </option>
              ))}
            </select>
          )}
        </Field>
      </div>
      <div className="flex flex-wrap gap-4">
        {text(
          'samplePeriodS',
          'Sample period (s)',
          'Seconds between two samples of the loop; the model is sampled at this period.',
          'w-32',
        )}
        <TimeZoneField register={register} error={errors.timeZone?.message} />
      </div>
      <Field label="Description" error={errors.description?.message}>
        {({ inputId, describedBy, invalid }) => (
          <textarea
            id={inputId}
            rows={2}
            aria-describedby={describedBy}
            aria-invalid={invalid || undefined}
            className={`w-full ${INPUT_CLASSES}`}
            {...register('description')}
          />
        )}
      </Field>
      {SIGNAL_GROUPS.map((group) => (
        <SignalRows key={group} group={group} control={control} register={register} errors={errors} />
      ))}
      {errors.root?.server ? (
        <p role="alert" className="rounded-sm border-l-4 border-l-diverged bg-panel px-3 py-2 text-sm">
          {errors.root.server.message}
        </p>
      ) : null}
      <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? 'Saving…' : submitLabel}
      </Button>
    </form>
  );
}
