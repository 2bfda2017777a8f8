import type { ImportProgress } from '../api/start-import';

const count = (n: number) => n.toLocaleString('en-GB');

/** A bar against the file's estimated rows and the running tally. */
export function ImportProgressView({
  progress,
  estimatedRows,
}: {
  progress: ImportProgress | null;
  estimatedRows: number;
}) {
  const read = progress?.rowsRead ?? 0;
  const percent = Math.min(99, Math.floor((100 * read) / Math.max(1, estimatedRows)));
  return (
    <section
      aria-label="Import progress"
      className="space-y-1 rounded-sm border border-rule bg-panel px-4 py-3 text-sm"
    >
      <h2 className="font-bold">Importing…</h2>
      <progress aria-label="Rows read" max={estimatedRows} value={read} className="h-3 w-full accent-ink" />
      <p className="tabular-nums" aria-live="polite">
        {progress
          ? `${count(read)} of about ${count(estimatedRows)} rows read (about ${percent} %) · ${count(progress.accepted)} accepted · ${count(progress.duplicates)} duplicates · ${count(progress.rejected)} rejected`
          : 'Uploading the file…'}
      </p>
    </section>
  );
}
