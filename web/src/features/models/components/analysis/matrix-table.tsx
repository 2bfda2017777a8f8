import type { ReactNode } from 'react';
import { formatNumber } from '../../../../lib/format-number';

type MatrixTableProps = {
  title: string;
  matrix: number[][];
  rowLabels: string[];
  columnLabels: string[];
  /** Extra content under a cell's number (e.g. what it was before). */
  cellNote?: (row: number, column: number) => ReactNode;
  highlight?: (row: number, column: number) => boolean;
};

/** A matrix read-only, rows and columns named after the loop's signals. */
export function MatrixTable({ title, matrix, rowLabels, columnLabels, cellNote, highlight }: MatrixTableProps) {
  return (
    <figure className="min-w-0 space-y-1">
      <figcaption className="text-sm font-bold">{title}</figcaption>
      <div className="w-fit max-w-full overflow-x-auto rounded-sm border border-rule bg-panel">
        <table className="border-collapse text-sm tabular-nums">
          <thead>
            <tr>
              <th className="bg-paper px-2 py-1" />
              {(matrix[0] ?? []).map((_, j) => (
                <th key={j} scope="col" className="bg-paper px-2 py-1 text-right text-xs font-medium">
                  {columnLabels[j] ?? `column ${j + 1}`}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {matrix.map((row, i) => (
              <tr key={i}>
                <th scope="row" className="bg-paper px-2 py-1 text-left text-xs font-medium whitespace-nowrap">
                  {rowLabels[i] ?? `row ${i + 1}`}
                </th>
                {row.map((value, j) => (
                  <td
                    key={j}
                    className={`border-t border-rule px-2 py-1 text-right ${highlight?.(i, j) ? 'bg-twin/10 font-bold outline outline-1 -outline-offset-1 outline-twin' : ''}`}
                  >
                    {formatNumber(value, 5)}
                    {cellNote?.(i, j)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </figure>
  );
}
