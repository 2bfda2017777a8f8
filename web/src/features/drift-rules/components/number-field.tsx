import { Field, INPUT_CLASSES } from '../../../components/ui/field';

type NumberFieldProps = {
  label: string;
  unit?: string;
  hint?: string;
  value: string;
  error?: string;
  onChange: (value: string) => void;
};

/** A number typed as text, so half-typed values stay as they are; the unit sits beside it. */
export function NumberField({ label, unit, hint, value, error, onChange }: NumberFieldProps) {
  return (
    <Field label={unit ? `${label} (${unit})` : label} hint={hint} error={error}>
      {({ inputId, describedBy, invalid }) => (
        <input
          id={inputId}
          inputMode="decimal"
          aria-describedby={describedBy}
          aria-invalid={invalid}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className={`w-32 tabular-nums ${INPUT_CLASSES}`}
        />
      )}
    </Field>
  );
}

type PerOutputFieldsProps = {
  legend: string;
  hint?: string;
  field: 'limits' | 'sigma';
  outputs: { name: string; unit: string }[];
  values: string[];
  errors: Record<string, string>;
  onChange: (values: string[]) => void;
};

/** One number per output of the loop, each labelled with the output's name and unit. */
export function PerOutputFields({ legend, hint, field, outputs, values, errors, onChange }: PerOutputFieldsProps) {
  return (
    <fieldset className="space-y-1">
      <legend className="text-sm font-medium">{legend}</legend>
      {hint ? <p className="text-xs text-ink/70">{hint}</p> : null}
      {errors[field] ? <p className="text-xs font-medium text-diverged">{errors[field]}</p> : null}
      <div className="flex flex-wrap gap-3">
        {outputs.map((output, i) => (
          <NumberField
            key={output.name}
            label={output.name}
            unit={output.unit || undefined}
            value={values[i] ?? ''}
            error={errors[`${field}.${i}`]}
            onChange={(value) => onChange(values.map((old, j) => (j === i ? value : old)))}
          />
        ))}
      </div>
    </fieldset>
  );
}
