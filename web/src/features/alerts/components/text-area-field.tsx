import { Field, INPUT_CLASSES } from '../../../components/ui/field';

type TextAreaFieldProps = {
  label: string;
  hint?: string;
  error?: string;
  value: string;
  onChange: (value: string) => void;
};

/** A required free-text answer (a reason, a note) with its problem shown under it. */
export function TextAreaField({ label, hint, error, value, onChange }: TextAreaFieldProps) {
  return (
    <Field label={label} hint={hint} error={error}>
      {({ inputId, describedBy, invalid }) => (
        <textarea
          id={inputId}
          aria-describedby={describedBy}
          aria-invalid={invalid}
          rows={3}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className={`w-full ${INPUT_CLASSES}`}
        />
      )}
    </Field>
  );
}
