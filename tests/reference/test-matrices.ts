import { randomMatrix } from './support.js';

/**
 * Small dense helpers and test-matrix builders for the reference suites, written here (not taken
 * from the engine) so that a reference never leans on the code it checks.
 */

/** Matrix product X Y. */
export function product(X: number[][], Y: number[][]): number[][] {
  return X.map((row) => Y[0].map((_, j) => row.reduce((s, x, k) => s + x * Y[k][j], 0)));
}

/** Inverse by Gauss–Jordan elimination with partial pivoting. */
export function inverse(S: number[][]): number[][] {
  const n = S.length;
  const a = S.map((row, i) => [...row, ...row.map((_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    [a[c], a[p]] = [a[p], a[c]];
    const pivot = a[c][c];
    a[c] = a[c].map((x) => x / pivot);
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r][c];
      if (f !== 0) a[r] = a[r].map((x, j) => x - f * a[c][j]);
    }
  }
  return a.map((row) => row.slice(n));
}

/** S J S⁻¹: a matrix with the eigenstructure of J in a random basis. */
export function similarity(S: number[][], J: number[][]): number[][] {
  return product(product(S, J), inverse(S));
}

/** I·shift + a random matrix: a well-conditioned random basis. */
export function randomBasis(random: () => number, n: number, shift = 2): number[][] {
  return randomMatrix(random, n, n).map((row, i) => row.map((x, j) => x + (i === j ? shift : 0)));
}

/** Gram–Schmidt on the columns of M (two passes, for orthogonality to rounding). */
export function orthonormalColumns(M: number[][]): number[][] {
  const n = M.length;
  const columns: number[][] = [];
  for (let j = 0; j < n; j++) {
    let v = M.map((row) => row[j]);
    for (let pass = 0; pass < 2; pass++) {
      for (const q of columns) {
        const d = v.reduce((s, x, i) => s + x * q[i], 0);
        v = v.map((x, i) => x - d * q[i]);
      }
    }
    const norm = Math.hypot(...v);
    columns.push(v.map((x) => x / norm));
  }
  return Array.from({ length: n }, (_, i) => columns.map((c) => c[i]));
}

/** S D S⁻¹ with distinct real D: non-symmetric, with a real spectrum spread over (−0.9, 0.9). */
export function realSpectrumMatrix(random: () => number, n: number): number[][] {
  const S = randomMatrix(random, n, n, 0.5).map((row, i) => row.map((x, j) => x + (i === j ? 1 : 0)));
  const D = Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => (i === j ? -0.9 + (1.8 * i) / n + 0.01 * random() : 0)),
  );
  return similarity(S, D);
}

/** Q·blockdiag(r_i R(θ_i))·Qᵀ for even n, Q orthogonal: n/2 complex pairs with distinct radii r_i. */
export function complexSpectrumMatrix(random: () => number, n: number): number[][] {
  const D = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i += 2) {
    const r = 0.2 + (0.75 * i) / n + 0.01 * random();
    const theta = 0.3 + 2.5 * random();
    [D[i][i], D[i][i + 1], D[i + 1][i], D[i + 1][i + 1]] = [
      r * Math.cos(theta),
      -r * Math.sin(theta),
      r * Math.sin(theta),
      r * Math.cos(theta),
    ];
  }
  const Q = orthonormalColumns(randomMatrix(random, n, n));
  const Qt = Q[0].map((_, j) => Q.map((row) => row[j]));
  return product(product(Q, D), Qt);
}
