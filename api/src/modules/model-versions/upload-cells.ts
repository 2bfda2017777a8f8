import Papa from 'papaparse';
import type { Matrix } from '@shadowloop/simulator/engine';
import type { UploadProblem } from '../../contracts/registry.js';

const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const isBlankRow = (row: unknown[]) => row.every((cell) => typeof cell === 'string' && cell.trim() === '');

/** A cell as a number: CSV cells are decimal text; JSON cells must already be numbers. */
function cellValue(cell: unknown, fromText: boolean): number | undefined {
  if (typeof cell === 'number') return Number.isFinite(cell) ? cell : undefined;
  if (fromText && typeof cell === 'string' && DECIMAL.test(cell.trim())) return Number(cell.trim());
  return undefined;
}

const describeCell = (cell: unknown) =>
  typeof cell === 'string' ? `"${cell.trim()}"` : (JSON.stringify(cell) ?? String(cell));

/**
 * Reads rows of cells into a matrix, reporting every non-number cell and every row whose length
 * differs from the first row's, with rows and columns counted from 1.
 */
export function readCells(
  file: string,
  matrix: string,
  rows: unknown[],
  fromText: boolean,
  problems: UploadProblem[],
): Matrix | undefined {
  const report = (row: number | null, column: number | null, message: string) =>
    problems.push({ file, row, column, message: `${matrix}: ${message}` });
  const before = problems.length;
  const result: Matrix = [];
  let width: number | undefined;
  rows.forEach((row, i) => {
    if (!Array.isArray(row)) return report(i + 1, null, `row ${i + 1} is not a list of numbers`);
    if (fromText && isBlankRow(row)) return;
    width ??= row.length;
    if (row.length !== width)
      report(i + 1, null, `row ${i + 1} has ${row.length} values, expected ${width} as in the first row`);
    result.push(
      row.map((cell: unknown, j) => {
        const value = cellValue(cell, fromText);
        if (value === undefined)
          report(i + 1, j + 1, `${describeCell(cell)} in row ${i + 1}, column ${j + 1} is not a number`);
        return value ?? Number.NaN;
      }),
    );
  });
  if (result.length === 0 || width === 0) report(null, null, 'holds no numbers');
  return problems.length === before ? result : undefined;
}

/**
 * One CSV file as a matrix. Tab-separated when the text holds a tab (a spreadsheet copy), else
 * comma-separated: chosen here rather than guessed, as a one-row or one-column file gives a guesser
 * nothing to go on.
 */
export function readCsvMatrix(
  file: string,
  matrix: string,
  text: string,
  problems: UploadProblem[],
): Matrix | undefined {
  const parsed = Papa.parse<string[]>(text, { delimiter: text.includes('\t') ? '\t' : ',', skipEmptyLines: false });
  const structural = parsed.errors.filter((e) => e.code === 'MissingQuotes' || e.code === 'InvalidQuotes');
  for (const error of structural)
    problems.push({
      file,
      row: error.row === undefined ? null : error.row + 1,
      column: null,
      message: `${matrix}: ${error.message}`,
    });
  if (structural.length) return undefined;
  return readCells(file, matrix, parsed.data, true, problems);
}
