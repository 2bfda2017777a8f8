import { Matrix as MlMatrix } from 'ml-matrix';
import type { Matrix } from './types.js';

/** Small dense helpers shared by the engine modules (plain arrays in, plain arrays out). */

/** The n×n identity. */
export function identity(n: number): Matrix {
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
}

/** An r×c zero matrix. */
export function zeros(rows: number, columns: number): Matrix {
  return Array.from({ length: rows }, () => new Array<number>(columns).fill(0));
}

/** Wraps a plain matrix for ml-matrix (copies, so the caller's array is never changed). */
export function toMl(M: Matrix): MlMatrix {
  return new MlMatrix(M);
}

/** Back to plain rows. */
export function fromMl(M: MlMatrix): Matrix {
  return M.to2DArray();
}

/** Matrix product `X Y` (shapes are the caller's responsibility). */
export function multiply(X: Matrix, Y: Matrix): Matrix {
  const rows = X.length;
  const inner = Y.length;
  const columns = Y[0].length;
  const out = zeros(rows, columns);
  for (let i = 0; i < rows; i++) {
    const xi = X[i];
    const oi = out[i];
    for (let k = 0; k < inner; k++) {
      const a = xi[k];
      if (a === 0) continue;
      const yk = Y[k];
      for (let j = 0; j < columns; j++) oi[j] += a * yk[j];
    }
  }
  return out;
}

/** Matrix-vector product `X v`. */
export function multiplyVector(X: Matrix, v: ArrayLike<number>): number[] {
  return X.map((row) => {
    let s = 0;
    for (let j = 0; j < row.length; j++) s += row[j] * v[j];
    return s;
  });
}

/** Element-wise sum `X + Y`. */
export function add(X: Matrix, Y: Matrix): Matrix {
  return X.map((row, i) => row.map((x, j) => x + Y[i][j]));
}

/** `X += Y`, returning X (for fresh intermediate results only). */
export function addInPlace(X: Matrix, Y: Matrix): Matrix {
  X.forEach((row, i) => {
    const y = Y[i];
    for (let j = 0; j < row.length; j++) row[j] += y[j];
  });
  return X;
}

/** Transpose. */
export function transpose(X: Matrix): Matrix {
  return X[0].map((_, j) => X.map((row) => row[j]));
}

/** Copy of a matrix. */
export function copy(X: Matrix): Matrix {
  return X.map((row) => row.slice());
}
