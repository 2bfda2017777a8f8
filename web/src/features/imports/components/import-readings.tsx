import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/errors/error-notice';
import type { Loop } from '../../loops/api/get-loops';
import { importProgressQueryOptions } from '../api/get-import';
import { usePreviewImport } from '../api/preview-import';
import { useStartImport } from '../api/start-import';
import { estimateRows } from '../utils/import-estimate';
import { toImportMapping, type MappingValues } from '../utils/import-mapping';
import { ColumnMappingForm } from './column-mapping-form';
import { CsvPreviewTable } from './csv-preview-table';
import { ImportProgressView } from './import-progress-view';
import { ImportResult } from './import-result';
import { CsvFileField } from './csv-file-field';

/** Choose a file → see its first rows → map the columns → import with progress → the tally. */
export function ImportReadings({ loop }: { loop: Loop }) {
  const [file, setFile] = useState<File | null>(null);
  const [importId, setImportId] = useState<string | null>(null);
  const preview = usePreviewImport(loop.id);
  const start = useStartImport(loop.id);
  const progress = useQuery(importProgressQueryOptions(importId, start.isPending));

  const choose = (chosen: File | null) => {
    setFile(chosen);
    start.reset();
    setImportId(null);
    if (chosen) preview.mutate(chosen);
    else preview.reset();
  };
  const runImport = (values: MappingValues) => {
    if (!file) return;
    const id = crypto.randomUUID();
    setImportId(id);
    start.mutate({ importId: id, mapping: toImportMapping(values), file });
  };

  return (
    <div className="space-y-4">
      <CsvFileField
        label="CSV file of readings"
        hint={`One row per sample: a time column and one column per input and output of ${loop.tag}. Rows for a slot that already has a reading count as duplicates.`}
        onChoose={choose}
      />
      {preview.isPending ? <p role="status">Reading the first rows…</p> : null}
      {preview.isError ? <ErrorNotice error={preview.error} /> : null}
      {preview.data && file ? (
        <>
          <CsvPreviewTable preview={preview.data} fileName={file.name} />
          <ColumnMappingForm
            key={file.name + file.size}
            loop={loop}
            preview={preview.data}
            busy={start.isPending}
            onImport={runImport}
          />
          {start.isPending ? (
            <ImportProgressView
              progress={progress.data ?? null}
              estimatedRows={estimateRows(file.size, preview.data.header, preview.data.rows, progress.data?.rowsRead)}
            />
          ) : null}
        </>
      ) : null}
      {start.isError ? <ErrorNotice error={start.error} /> : null}
      {start.data ? <ImportResult result={start.data} /> : null}
    </div>
  );
}
