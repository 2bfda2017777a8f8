import { Field, INPUT_CLASSES } from './field';

type NoteFieldProps = {
  label: string;
  hint?: string;
  value: string;
  onChange: (value: string) => void;
};

/** A short free-text note (review note, reason, retirement note) in a two-line box. */
export function NoteField({ label, hint, value, onChange }: NoteFieldProps) {
  return (
    <Field label={label} hint={hint}>
      {({ inputId, describedBy }) => (
        <textarea
          id={inputId}
          aria-describedby={describedBy}
          rows={2}
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
