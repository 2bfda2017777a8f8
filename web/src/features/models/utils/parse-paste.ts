import { parseCellNumber } from '../../../lib/parse-number';

export type PasteSeparator = 'tab' | 'semicolon' | 'comma' | 'space';

export type PasteProblem = { row: number; column: number; text: string; message: string };

/** A pasted block: `null` marks an empty cell, which leaves the target cell as it was. */
export type PastedBlock = {
  separator: PasteSeparator;
  values: (number | null)[][];
  width: number;
  problems: PasteProblem[];
};

const SPLITTERS: Record<PasteSeparator, RegExp> = {
  tab: /\t/,
  semicolon: /;/,
  comma: /,/,
  space: /\s+/,
};

/**
 * Which separator a block of copied text uses. A spreadsheet copies with tabs; a CSV file uses
 * commas, or semicolons where the comma is the decimal mark; printed matrices use spaces.
 */
export function detectSeparator(text: string): PasteSeparator {
  if (text.includes('\t')) return 'tab';
  if (text.includes(';')) return 'semicolon';
  if (text.includes(',')) return 'comma';
  return 'space';
}

function splitLines(text: string): string[] {
  const lines = text.split(/\r\n|\n|\r/);
  while (lines.length > 0 && lines[lines.length - 1].trim() === '') lines.pop();
  return lines;
}

/**
 * Parses text copied from a spreadsheet or a CSV file into rows of numbers. Rows may be ragged;
 * every cell that is not a number is reported with its row and column (counted from 1).
 */
export function parsePastedText(text: string): PastedBlock {
  const separator = detectSeparator(text);
  const allowDecimalComma = separator === 'tab' || separator === 'semicolon';
  const problems: PasteProblem[] = [];
  const values = splitLines(text).map((line, rowIndex) => {
    const cells = separator === 'space' ? line.trim().split(SPLITTERS.space) : line.split(SPLITTERS[separator]);
    return cells.map((cell, columnIndex) => {
      const value = parseCellNumber(cell, allowDecimalComma);
      if (value !== undefined) return value;
      problems.push({
        row: rowIndex + 1,
        column: columnIndex + 1,
        text: cell.trim(),
        message: `row ${rowIndex + 1}, column ${columnIndex + 1}: “${cell.trim()}” is not a number`,
      });
      return null;
    });
  });
  const width = values.reduce((widest, row) => Math.max(widest, row.length), 0);
  return { separator, values, width, problems };
}
