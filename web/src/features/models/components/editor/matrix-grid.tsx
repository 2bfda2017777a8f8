import { useState, type ClipboardEvent } from 'react';
import { parseCellNumber } from '../../../../lib/parse-number';
import { plural } from '../../../../lib/format-number';
import { applyPastedBlock, setCell, type CellGrid } from '../../utils/matrix-cells';
import { parsePastedText } from '../../utils/parse-paste';

type MatrixGridProps = {
  name: string;
  title: string;
  rowLabels: string[];
  columnLabels: string[];
  grid: CellGrid;
  onChange: (grid: CellGrid) => void;
  /** Zero-based cells the server refused, with its message. */
  flagged?: { row: number; column: number; message: string }[];
};

/** A paste that reads as one number goes into one cell as usual; anything else is a block. */
function isBlock(text: string): boolean {
  const trimmed = text.trim();
  return /[\t\n\r;]/.test(trimmed) || (/[,\s]/.test(trimmed) && parseCellNumber(trimmed) === undefined);
}

/** One matrix as a table of cells labelled with the loop's signal names; a spreadsheet block pastes from the cell in focus. */
export function MatrixGrid({ name, title, rowLabels, columnLabels, grid, onChange, flagged = [] }: MatrixGridProps) {
  const [notice, setNotice] = useState<{ text: string; problem: boolean } | null>(null);
  const columns = grid[0]?.length ?? 0;

  const paste = (event: ClipboardEvent<HTMLInputElement>, row: number, column: number) => {
    const text = event.clipboardData.getData('text/plain');
    if (!isBlock(text)) return;
    event.preventDefault();
    const block = parsePastedText(text);
    if (block.problems.length > 0) {
      const shown = block.problems
        .slice(0, 4)
        .map((p) => p.message)
        .join('; ');
      setNotice({
        text: `Nothing was pasted into ${name}: ${shown}${block.problems.length > 4 ? '; …' : ''}.`,
        problem: true,
      });
      return;
    }
    const result = applyPastedBlock(grid, block, { row, column });
    onChange(result.grid);
    const clipped =
      result.clipped > 0
        ? ` ${plural(result.clipped, 'value')} fell outside ${name} and ${result.clipped === 1 ? 'was' : 'were'} left out.`
        : '';
    setNotice({
      text: `Pasted ${plural(result.written, 'value')} into ${name} from row ${row + 1}, column ${column + 1}.${clipped}`,
      problem: result.clipped > 0,
    });
  };

  return (
    <figure className="min-w-0 space-y-1">
      <figcaption className="text-sm font-bold">{title}</figcaption>
      <div className="w-fit max-w-full overflow-x-auto rounded-sm border border-rule bg-panel">
        <table className="border-collapse text-sm" aria-label={`Matrix ${name}`}>
          <thead>
            <tr>
              <th className="bg-paper px-2 py-1" />
              {Array.from({ length: columns }, (_, j) => (
                <th key={j} scope="col" className="bg-paper px-2 py-1 text-left text-xs font-medium">
                  {columnLabels[j] ?? `column ${j + 1}`}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {grid.map((cells, i) => (
              <tr key={i}>
                <th scope="row" className="bg-paper px-2 py-1 text-left text-xs font-medium whitespace-nowrap">
                  {rowLabels[i] ?? `row ${i + 1}`}
                </th>
                {cells.map((text, j) => {
                  const serverProblem = flagged.find((f) => f.row === i && f.column === j);
                  const unreadable = text.trim() !== '' && parseCellNumber(text) === undefined;
                  return (
                    <td key={j} className="p-0.5">
                      <input
                        aria-label={`${name} row ${i + 1} (${rowLabels[i] ?? i + 1}), column ${j + 1} (${columnLabels[j] ?? j + 1})`}
                        aria-invalid={unreadable || serverProblem ? true : undefined}
                        title={serverProblem?.message ?? (unreadable ? 'not a number' : undefined)}
                        inputMode="decimal"
                        value={text}
                        onChange={(event) => onChange(setCell(grid, i, j, event.target.value))}
                        onPaste={(event) => paste(event, i, j)}
                        className="w-24 rounded-sm border border-rule px-1.5 py-1 text-right tabular-nums focus:border-twin focus:outline-none aria-[invalid=true]:border-2 aria-[invalid=true]:border-diverged"
                      />
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p
        aria-live="polite"
        className={`min-h-4 text-xs ${notice?.problem ? 'font-medium text-diverged' : 'text-ink/75'}`}
      >
        {notice?.text ?? ''}
      </p>
    </figure>
  );
}
