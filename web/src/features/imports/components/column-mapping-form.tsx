import { useForm, type Resolver } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import type { Loop } from '../../loops/api/get-loops';
import { nestErrors } from '../../loops/utils/field-errors';
import type { ImportPreview } from '../api/preview-import';
import { initialMapping, validateMapping, type MappingValues } from '../utils/import-mapping';

type ColumnMappingFormProps = {
  loop: Loop;
  preview: ImportPreview;
  busy: boolean;
  onImport: (values: MappingValues) => void;
  /** The button's words: what happens to the mapped rows. */
  submitLabel?: string;
};

function mappingResolver(preview: ImportPreview, loop: Loop): Resolver<MappingValues> {
  return (values) => {
    const problems = validateMapping(values, preview.header, loop);
    const list = Object.entries(problems).map(([path, message]) => ({ path, message: message ?? '' }));
    return list.length ? { values: {}, errors: nestErrors<MappingValues>(list) } : { values, errors: {} };
  };
}

/** Which CSV column holds the time and each signal (by name and unit); prefilled from matching headers. */
export function ColumnMappingForm({
  loop,
  preview,
  busy,
  onImport,
  submitLabel = 'Import readings',
}: ColumnMappingFormProps) {
  const initial = initialMapping(preview, loop);
  const { register, handleSubmit, formState } = useForm<MappingValues>({
    defaultValues: initial,
    resolver: mappingResolver(preview, loop),
  });
  const options = [
    <option key="none" value="">
      Choose a column
    </option>,
    ...preview.header.map((name, i) => (
      <option key={i} value={String(i)}>
        {name || `column ${i + 1}`}
      </option>
    )),
  ];
  const select = (path: 't' | `u.${number}` | `y.${number}`, label: string, hint: string, error?: string) => {
    const [group, index] = path.split('.');
    // React selects the default option itself; some DOMs ignore a value set before the options exist.
    const defaultValue = group === 't' ? initial.t : initial[group as 'u' | 'y'][Number(index)];
    return (
      <Field key={path} label={label} hint={hint} error={error}>
        {({ inputId, describedBy, invalid }) => (
          <select
            id={inputId}
            aria-describedby={describedBy}
            aria-invalid={invalid}
            defaultValue={defaultValue}
            className={INPUT_CLASSES}
            {...register(path)}
          >
            {options}
          </select>
        )}
      </Field>
    );
  };
  const errors = formState.errors;

  return (
    <form
      onSubmit={(e) => void handleSubmit(onImport)(e)}
      aria-label="Column mapping"
      className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3"
    >
      <h2 className="font-bold">Map the columns</h2>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        {select(
          't',
          'Time',
          'ISO 8601, e.g. 2025-03-01T08:00:00Z; each row goes to its sample slot',
          errors.t?.message,
        )}
        {loop.inputs.map((s, i) =>
          select(`u.${i}`, `Input: ${s.name}`, `values in ${s.unit || 'its unit'}`, errors.u?.[i]?.message),
        )}
        {loop.outputs.map((s, i) =>
          select(`y.${i}`, `Output: ${s.name}`, `values in ${s.unit || 'its unit'}`, errors.y?.[i]?.message),
        )}
      </div>
      <Button type="submit" variant="primary" disabled={busy}>
        {submitLabel}
      </Button>
    </form>
  );
}
