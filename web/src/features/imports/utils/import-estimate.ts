/**
 * About how many data rows the file holds, from its size and the preview's average row length, so
 * the progress bar has an end; never less than the rows already read.
 */
export function estimateRows(
  fileBytes: number,
  header: readonly string[],
  rows: readonly (readonly string[])[],
  rowsRead = 0,
): number {
  if (rows.length === 0) return Math.max(rowsRead, 1);
  const lineBytes = (cells: readonly string[]) => new TextEncoder().encode(cells.join(',')).length + 1;
  const average = rows.reduce((sum, row) => sum + lineBytes(row), 0) / rows.length;
  const estimate = Math.round((fileBytes - lineBytes(header)) / average);
  return Math.max(rowsRead, estimate, 1);
}
