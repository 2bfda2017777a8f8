import type { Matrix } from './types.js';

/**
 * Guard clauses for programmer errors: they throw a `RangeError` naming the function, the argument
 * and the expected shape. User-supplied matrices go through `validateModel` first, which never throws.
 */

/** Throws unless `M` is a non-empty array of equally long, non-empty rows; returns `[rows, columns]`. */
export function assertMatrix(where: string, name: string, M: Matrix): [number, number] {
  if (!Array.isArray(M) || M.length === 0 || !Array.isArray(M[0]) || M[0].length === 0) {
    throw new RangeError(`${where}: ${name} must be a non-empty matrix (array of rows)`);
  }
  const columns = M[0].length;
  for (let i = 1; i < M.length; i++) {
    if (!Array.isArray(M[i]) || M[i].length !== columns) {
      throw new RangeError(`${where}: ${name} row ${i + 1} has ${rowLength(M[i])} columns, expected ${columns}`);
    }
  }
  return [M.length, columns];
}

/** Throws unless `M` is a square matrix; returns its order. */
export function assertSquare(where: string, name: string, M: Matrix): number {
  const [rows, columns] = assertMatrix(where, name, M);
  if (rows !== columns) throw new RangeError(`${where}: ${name} must be square, got ${rows}×${columns}`);
  return rows;
}

/** Throws unless `M` has exactly `rows` rows (and is a matrix); returns its column count. */
export function assertRows(where: string, name: string, M: Matrix, rows: number, why: string): number {
  const [r, c] = assertMatrix(where, name, M);
  if (r !== rows) throw new RangeError(`${where}: ${name} has ${r} rows, expected ${rows} (${why})`);
  return c;
}

/** Throws unless `M` has exactly `columns` columns (and is a matrix); returns its row count. */
export function assertColumns(where: string, name: string, M: Matrix, columns: number, why: string): number {
  const [r, c] = assertMatrix(where, name, M);
  if (c !== columns) throw new RangeError(`${where}: ${name} has ${c} columns, expected ${columns} (${why})`);
  return r;
}

/** Throws unless `v` is an array-like vector of length `length`. */
export function assertVector(where: string, name: string, v: ArrayLike<number>, length: number): void {
  if (v === null || typeof v !== 'object' || v.length !== length) {
    const got = v !== null && typeof v === 'object' ? v.length : typeof v;
    throw new RangeError(`${where}: ${name} must have length ${length}, got ${got}`);
  }
}

/** Throws unless `k` is an integer ≥ 0. */
export function assertCount(where: string, name: string, k: number): void {
  if (!Number.isInteger(k) || k < 0) throw new RangeError(`${where}: ${name} must be an integer ≥ 0, got ${k}`);
}

function rowLength(row: unknown): number | string {
  return Array.isArray(row) ? row.length : 'no';
}
