import { useState } from 'react';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { usePreviewImport } from '../../imports/api/preview-import';
import { ColumnMappingForm } from '../../imports/components/column-mapping-form';
import { CsvPreviewTable } from '../../imports/components/csv-preview-table';
import { toImportMapping } from '../../imports/utils/import-mapping';
import type { Loop } from '../../loops/api/get-loops';
import type { BacktestSource } from '../types';
import { CsvFileField } from '../../imports/components/csv-file-field';

type UploadSourceProps = { loop: Loop; busy: boolean; onStart: (source: BacktestSource) => void };

/**
 * The readings import's own steps — the file's first rows, then the column mapping — but the rows
 * go to this backtest alone, never to the loop's stored readings.
 */
export function UploadSource({ loop, busy, onStart }: UploadSourceProps) {
  const [file, setFile] = useState<File | null>(null);
  const preview = usePreviewImport(loop.id);

  const choose = (chosen: File | null) => {
    setFile(chosen);
    if (chosen) preview.mutate(chosen);
    else preview.reset();
  };

  return (
    <div className="space-y-3">
      <CsvFileField
        label="CSV file of readings for the backtest"
        hint={`One row per sample: a time column and one column per input and output of ${loop.tag}, checked as an import is. The rows are kept with this backtest only; the loop's stored readings and the live twin do not change.`}
        onChoose={choose}
      />
      {preview.isPending ? <p role="status">Reading the first rows…</p> : null}
      {preview.isError ? <ErrorNotice error={preview.error} /> : null}
      {preview.data && file ? (
        <>
          <CsvPreviewTable preview={preview.data} fileName={file.name} />
          <p className="text-sm">
            Map the columns, then start: the file is uploaded to this backtest (its rows are not imported into the
            loop&apos;s readings).
          </p>
          <ColumnMappingForm
            key={file.name + file.size}
            loop={loop}
            preview={preview.data}
            busy={busy}
            submitLabel="Start backtest"
            onImport={(values) => onStart({ source: 'upload', mapping: toImportMapping(values), file })}
          />
        </>
      ) : null}
    </div>
  );
}
