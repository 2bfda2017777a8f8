import type { Matrix } from '../types.js';
import { seededUniform } from '../../lib/seeded-random.js';

/** Deterministic uniform generator on [0, 1) (mulberry32), so every identity test sees the same matrices. */
export const seededRandom = seededUniform;

/** rows×columns matrix with entries uniform on [−scale, scale). */
export function randomMatrix(random: () => number, rows: number, columns: number, scale = 1): Matrix {
  return Array.from({ length: rows }, () => Array.from({ length: columns }, () => scale * (2 * random() - 1)));
}

/** Largest absolute entry of X − Y. */
export function maxAbsDifference(X: Matrix, Y: Matrix): number {
  let worst = 0;
  X.forEach((row, i) => row.forEach((x, j) => (worst = Math.max(worst, Math.abs(x - Y[i][j])))));
  return worst;
}

/** Largest absolute entry of X. */
export function maxAbs(X: Matrix): number {
  return X.reduce((m, row) => row.reduce((r, x) => Math.max(r, Math.abs(x)), m), 0);
}

/** Block-diagonal matrix from square blocks. */
export function blockDiagonal(...blocks: Matrix[]): Matrix {
  const n = blocks.reduce((s, b) => s + b.length, 0);
  const out = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  let offset = 0;
  for (const block of blocks) {
    block.forEach((row, i) => row.forEach((x, j) => (out[offset + i][offset + j] = x)));
    offset += block.length;
  }
  return out;
}
