import { Table, Td, Th } from '../../../components/ui/table';
import type { ImportPreview } from '../api/preview-import';

/** The first rows as the server read them, line numbers as in the file (the header is line 1). */
export function CsvPreviewTable({ preview, fileName }: { preview: ImportPreview; fileName: string }) {
  return (
    <section aria-label="First rows of the file" className="space-y-1">
      <h2 className="text-sm font-bold">
        First {preview.rows.length} rows of {fileName}
      </h2>
      <div className="max-h-72 overflow-y-auto">
        <Table caption={`First rows of ${fileName}`}>
          <thead>
            <tr>
              <Th>Line</Th>
              {preview.header.map((name, i) => (
                <Th key={i}>{name || `column ${i + 1}`}</Th>
              ))}
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {preview.rows.map((row, r) => (
              <tr key={r}>
                <Td className="text-ink/60">{r + 2}</Td>
                {preview.header.map((_, c) => (
                  <Td key={c}>{row[c] ?? ''}</Td>
                ))}
              </tr>
            ))}
          </tbody>
        </Table>
      </div>
    </section>
  );
}
