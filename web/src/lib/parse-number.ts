const SPACE_GROUPED = /^[+-]?\d{1,3}(?:[\s\u00a0\u2009\u202f]\d{3})+(?:[.,]\d+)?$/;
const MARK_GROUPED = /^[+-]?\d{1,3}(?:([.,])\d{3})(?:\1\d{3})*$/;

/**
 * Reads one number as typed or copied from a spreadsheet. Accepted: `0.982`, `-1.5e-3`, `−0.2`
 * (typographic minus), thousands grouped by spaces (`1 234.5`) or repeated marks (`1,234,567`),
 * and — when the comma does not separate cells — a decimal comma (`0,982`; a single comma is
 * always read as the decimal mark). When both `.` and `,` appear, the last one is the decimal mark.
 * Returns null for an empty cell and undefined for text that is not a finite number.
 */
export function parseCellNumber(text: string, allowDecimalComma = true): number | null | undefined {
  let clean = text
    .trim()
    .replace(/^"(.*)"$/s, '$1')
    .trim()
    .replace(/^[\u2212\u2013]/, '-')
    .replace(/e[\u2212\u2013]/i, 'e-');
  if (clean === '') return null;
  if (/\s/.test(clean)) {
    if (!SPACE_GROUPED.test(clean)) return undefined;
    clean = clean.replace(/\s/g, '');
  }
  const lastDot = clean.lastIndexOf('.');
  const lastComma = clean.lastIndexOf(',');
  if (lastDot >= 0 && lastComma >= 0) {
    clean = lastComma > lastDot ? clean.replace(/\./g, '').replace(',', '.') : clean.replace(/,/g, '');
  } else if (clean.split(',').length > 2 || clean.split('.').length > 2) {
    if (!MARK_GROUPED.test(clean)) return undefined;
    clean = clean.replace(/[.,]/g, '');
  } else if (lastComma >= 0) {
    if (!allowDecimalComma) return undefined;
    clean = clean.replace(',', '.');
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(clean)) return undefined;
  const value = Number(clean);
  return Number.isFinite(value) ? value : undefined;
}

/** The number in an editor cell, or a reason it is not one. */
export function readEditorCell(text: string): { value: number } | { problem: string } {
  const value = parseCellNumber(text);
  if (value === null) return { problem: 'empty' };
  if (value === undefined) return { problem: `“${text.trim()}” is not a number` };
  return { value };
}
