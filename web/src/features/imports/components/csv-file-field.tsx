import { Field } from '../../../components/ui/field';

/** The file picker of a CSV upload, with what the file must hold in the hint. */
export function CsvFileField({
  label,
  hint,
  onChoose,
}: {
  label: string;
  hint: string;
  onChoose: (file: File | null) => void;
}) {
  return (
    <Field label={label} hint={hint}>
      {({ inputId, describedBy }) => (
        <input
          id={inputId}
          aria-describedby={describedBy}
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => onChoose(e.target.files?.[0] ?? null)}
          className="text-sm"
        />
      )}
    </Field>
  );
}
