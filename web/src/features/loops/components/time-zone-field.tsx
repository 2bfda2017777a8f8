import { useId } from 'react';
import type { UseFormRegister } from 'react-hook-form';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import type { LoopFormValues } from '../utils/loop-form-values';

const TIME_ZONES: readonly string[] =
  typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : ['UTC'];

export function TimeZoneField({ register, error }: { register: UseFormRegister<LoopFormValues>; error?: string }) {
  const listId = useId();
  return (
    <Field label="Plant time zone" hint="Times on this loop’s pages are shown in this zone." error={error}>
      {({ inputId, describedBy, invalid }) => (
        <>
          <input
            id={inputId}
            list={listId}
            aria-describedby={describedBy}
            aria-invalid={invalid || undefined}
            className={`w-56 ${INPUT_CLASSES}`}
            {...register('timeZone')}
          />
          <datalist id={listId}>
            {TIME_ZONES.map((zone) => (
              <option key={zone} value={zone} />
            ))}
          </datalist>
        </>
      )}
    </Field>
  );
}
