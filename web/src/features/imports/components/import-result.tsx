import { RejectedRowsTable } from './rejected-rows-table';
import type { ImportProgress } from '../api/start-import';

const count = (n: number) => n.toLocaleString('en-GB');

/** The tally, and the bad rows with the file's line numbers and what was wrong. */
export function ImportResult({ result }: { result: ImportProgress }) {
  const unlisted = result.rejected - result.badRows.length;
  return (
    <section
      aria-label="Import result"
      className="space-y-2 rounded-sm border border-rule border-l-4 border-l-ink bg-panel px-4 py-3 text-sm"
    >
      <h2 className="font-bold">{result.error ? 'The import stopped' : `Import of ${result.fileName} finished`}</h2>
      {result.error ? (
        <p role="alert" className="text-diverged">
          {result.error}
        </p>
      ) : null}
      <dl className="grid max-w-lg grid-cols-[auto_1fr] gap-x-4 tabular-nums">
        <dt>Rows read</dt>
        <dd>{count(result.rowsRead)}</dd>
        <dt>Accepted</dt>
        <dd>{count(result.accepted)}</dd>
        <dt>Duplicates (slot already filled)</dt>
        <dd>{count(result.duplicates)}</dd>
        <dt>Rejected</dt>
        <dd>{count(result.rejected)}</dd>
      </dl>
      {result.badRows.length ? <RejectedRowsTable rows={result.badRows} caption="Rejected rows" /> : null}
      {unlisted > 0 ? (
        <p className="text-ink/75">
          {count(unlisted)} more rejected rows are not listed; fix the ones above and import the file again (accepted
          rows count as duplicates then).
        </p>
      ) : null}
    </section>
  );
}
