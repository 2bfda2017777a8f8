import { RejectedRowsTable } from '../../imports/components/rejected-rows-table';
import type { UploadTally as Tally } from '../types';
import { count } from '../utils/backtest-words';

/** What the upload's checks made of the file: counts in a line, the rejected rows by line number. */
export function UploadTally({ tally }: { tally: Tally }) {
  const unlisted = tally.rejected - tally.badRows.length;
  return (
    <section aria-label="Uploaded file" className="space-y-2 text-sm">
      <p className="tabular-nums">
        <strong>{tally.fileName}</strong>: {count(tally.rowsRead)} rows read, {count(tally.accepted)} used,{' '}
        {count(tally.duplicates)} duplicates (a second row for a slot), {count(tally.rejected)} rejected.
      </p>
      {tally.badRows.length ? (
        <details>
          <summary className="cursor-pointer">Rejected rows</summary>
          <RejectedRowsTable rows={tally.badRows} caption="Rejected rows of the uploaded file" />
          {unlisted > 0 ? <p className="text-ink/75">{count(unlisted)} more rejected rows are not listed.</p> : null}
        </details>
      ) : null}
    </section>
  );
}
