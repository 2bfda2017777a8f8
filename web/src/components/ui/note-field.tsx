import { Field, INPUT_CLASSES } from './field';

type NoteFieldProps = {
  label: string;
  hint?: string;
  /** The field's problem, shown under it. */
  error?: string;
  rows?: number;
  value: string;
  onChange: (value: string) => void;
};

/** A free-text note (review note, reason, retirement note, an alert's note) in a small box. */
export function NoteField({ label, hint, error, rows = 2, value, onChange }: NoteFieldProps) {
  return (
    <Field label={label} hint={hint} error={error}>
      {({ inputId, describedBy, invalid }) => (
        <textarea
          id={inputId}
          aria-describedby={describedBy}
          aria-invalid={invalid}
          rows={rows}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          className={`w-full max-w-2xl ${INPUT_CLASSES}`}
        />
      )}
    </Field>
  );
}

/** The body of an action whose note is optional: `{}` when nothing was written. */
export const optionalNote = (note: string): { note?: string } => (note.trim() ? { note: note.trim() } : {});
