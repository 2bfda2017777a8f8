import { readEditorCell } from '../../../lib/parse-number';
import type { PastedBlock } from './parse-paste';

/** What the editor holds for one matrix: the text of each cell, as typed or pasted. */
export type CellGrid = string[][];

export type CellProblem = { row: number; column: number; message: string };

export function emptyGrid(rows: number, columns: number, fill = ''): CellGrid {
  return Array.from({ length: rows }, () => new Array<string>(columns).fill(fill));
}

export function identityGrid(size: number, diagonal = '1'): CellGrid {
  return Array.from({ length: size }, (_, i) => Array.from({ length: size }, (_, j) => (i === j ? diagonal : '0')));
}

export function gridFromMatrix(matrix: number[][] | null | undefined, rows: number, columns: number): CellGrid {
  return Array.from({ length: rows }, (_, i) =>
    Array.from({ length: columns }, (_, j) => {
      const value = matrix?.[i]?.[j];
      return value === undefined ? '' : String(value);
    }),
  );
}

export function setCell(grid: CellGrid, row: number, column: number, text: string): CellGrid {
  return grid.map((cells, i) => (i === row ? cells.map((cell, j) => (j === column ? text : cell)) : cells));
}

/** Writes a pasted block into the grid from the given cell; what falls outside is counted, not written. */
export function applyPastedBlock(
  grid: CellGrid,
  block: PastedBlock,
  start: { row: number; column: number },
): { grid: CellGrid; written: number; clipped: number } {
  let written = 0;
  let clipped = 0;
  const next = grid.map((cells) => [...cells]);
  block.values.forEach((values, i) =>
    values.forEach((value, j) => {
      if (value === null) return;
      const row = start.row + i;
      const column = start.column + j;
      if (row >= next.length || column >= (next[row]?.length ?? 0)) {
        clipped += 1;
        return;
      }
      next[row][column] = String(value);
      written += 1;
    }),
  );
  return { grid: next, written, clipped };
}

/** The numbers of a grid, or every cell that is empty or not a number. */
export function readGrid(grid: CellGrid): { matrix: number[][] } | { problems: CellProblem[] } {
  const problems: CellProblem[] = [];
  const matrix = grid.map((cells, row) =>
    cells.map((text, column) => {
      const read = readEditorCell(text);
      if ('value' in read) return read.value;
      problems.push({ row, column, message: read.problem });
      return Number.NaN;
    }),
  );
  return problems.length > 0 ? { problems } : { matrix };
}

export function gridMatrixOrNull(grid: CellGrid): number[][] | null {
  const read = readGrid(grid);
  return 'matrix' in read ? read.matrix : null;
}
