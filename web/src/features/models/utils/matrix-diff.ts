import { formatNumber } from '../../../lib/format-number';

export type CellChange = { before: number; after: number; delta: number; changed: boolean };

export type MatrixDiff =
  | { kind: 'absent' }
  | { kind: 'added' | 'removed'; rows: number; columns: number }
  | { kind: 'reshaped'; before: string; after: string }
  | { kind: 'compared'; cells: CellChange[][]; changedCount: number };

/** Relative difference below which two entries count as the same (stored JSON round-trips exactly). */
const SAME_RELATIVE = 1e-12;

function shape(matrix: number[][]): string {
  return `${matrix.length}×${matrix[0]?.length ?? 0}`;
}

function differs(before: number, after: number): boolean {
  return Math.abs(after - before) > SAME_RELATIVE * Math.max(1, Math.abs(before), Math.abs(after));
}

/** Cell by cell comparison of one matrix in two versions (`before` is the version compared against). */
export function diffMatrix(before: number[][] | null | undefined, after: number[][] | null | undefined): MatrixDiff {
  if (!before && !after) return { kind: 'absent' };
  if (!before) return { kind: 'added', rows: after!.length, columns: after![0]?.length ?? 0 };
  if (!after) return { kind: 'removed', rows: before.length, columns: before[0]?.length ?? 0 };
  if (shape(before) !== shape(after)) return { kind: 'reshaped', before: shape(before), after: shape(after) };
  let changedCount = 0;
  const cells = after.map((row, i) =>
    row.map((value, j) => {
      const changed = differs(before[i][j], value);
      if (changed) changedCount += 1;
      return { before: before[i][j], after: value, delta: value - before[i][j], changed };
    }),
  );
  return { kind: 'compared', cells, changedCount };
}

/** `0.95 → 0.97 (+0.02)`: the change in numbers, so it never rests on colour. */
export function describeCellChange(cell: CellChange): string {
  if (!cell.changed) return formatNumber(cell.after);
  const sign = cell.delta > 0 ? '+' : '';
  return `${formatNumber(cell.before)} → ${formatNumber(cell.after)} (${sign}${formatNumber(cell.delta, 3)})`;
}

/** One sentence per matrix for the top of the comparison. */
export function summarizeDiff(name: string, diff: MatrixDiff): string {
  switch (diff.kind) {
    case 'absent':
      return `${name}: not given in either version.`;
    case 'added':
      return `${name}: only in this version (${diff.rows}×${diff.columns}).`;
    case 'removed':
      return `${name}: only in the other version (${diff.rows}×${diff.columns}).`;
    case 'reshaped':
      return `${name}: size changed from ${diff.before} to ${diff.after}, so cells cannot be compared one by one.`;
    case 'compared':
      return diff.changedCount === 0
        ? `${name}: unchanged.`
        : `${name}: ${diff.changedCount} of ${diff.cells.length * (diff.cells[0]?.length ?? 0)} cells changed.`;
  }
}
