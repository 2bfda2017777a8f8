import { formatNumber } from '../../../../lib/format-number';
import { diffMatrix, summarizeDiff } from '../../utils/matrix-diff';
import { MatrixTable } from '../analysis/matrix-table';

type MatrixComparisonProps = {
  name: string;
  title: string;
  before: number[][] | null;
  after: number[][] | null;
  beforeLabel: string;
  afterLabel: string;
  rowLabels: string[];
  columnLabels: string[];
};

/** One matrix of two versions side by side; changed cells are outlined and say what they were. */
export function MatrixComparison({
  name,
  title,
  before,
  after,
  beforeLabel,
  afterLabel,
  rowLabels,
  columnLabels,
}: MatrixComparisonProps) {
  const diff = diffMatrix(before, after);
  if (diff.kind === 'absent') return null;
  const changed = (i: number, j: number) => diff.kind === 'compared' && diff.cells[i][j].changed;
  const note = (i: number, j: number) => {
    if (diff.kind !== 'compared' || !diff.cells[i][j].changed) return null;
    const cell = diff.cells[i][j];
    return (
      <span className="block text-xs font-normal text-ink/80">
        was {formatNumber(cell.before, 5)} ({cell.delta > 0 ? '+' : ''}
        {formatNumber(cell.delta, 3)})
      </span>
    );
  };
  return (
    <div className="space-y-1">
      <p className="text-sm font-medium">{summarizeDiff(name, diff)}</p>
      <div className="flex flex-wrap gap-4">
        {before ? (
          <MatrixTable
            title={`${title} — ${beforeLabel}`}
            matrix={before}
            rowLabels={rowLabels}
            columnLabels={columnLabels}
          />
        ) : null}
        {after ? (
          <MatrixTable
            title={`${title} — ${afterLabel}`}
            matrix={after}
            rowLabels={rowLabels}
            columnLabels={columnLabels}
            highlight={changed}
            cellNote={note}
          />
        ) : null}
      </div>
    </div>
  );
}
