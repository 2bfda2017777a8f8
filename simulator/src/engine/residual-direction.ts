import { Matrix as MlMatrix, pseudoInverse } from 'ml-matrix';
import { identity } from './dense.js';
import { eigenSystem } from './eigen.js';
import { modalDecomposition } from './modal-decomposition.js';
import { assertColumns, assertSquare, assertVector } from './shape.js';
import type { Complex, Matrix } from './types.js';

/** One output's standardised mean residual z̄_j² as a share of Σ z̄². */
export const SENSOR_SIGNAL_SHARE = 0.8;
/** A mode (or conjugate pair) holding this share of the projected energy makes the residual lie along it. */
export const PROCESS_MODE_SHARE = 0.7;
/** An output "moves" when it carries at least this share of the standardised energy. */
export const MOVING_SIGNAL_SHARE = 0.1;

export interface ResidualDirectionInput {
  /** n×n state matrix of the active model. */
  A: Matrix;
  /** p×n output matrix; null means C = I (every state measured). */
  C: Matrix | null;
  /** Recent residual vectors r = y − ŷ (length p each, output units), oldest first. */
  residuals: number[][];
  /** Residual standard deviation per output (length p, > 0, output units). */
  sigma: number[];
}

export type ResidualPointer = 'sensor' | 'process' | 'unclear';

export interface ResidualDirectionResult {
  /** r̄_j: the mean residual per output over the window, output units. */
  meanResidual: number[];
  /** Per output j: share z̄_j² / Σ z̄² with z̄_j = r̄_j / σ_j; largest first. */
  signals: { index: number; share: number }[];
  /**
   * Per mode: share of the state-space residual's modal energy; a conjugate pair is one entry
   * (eigenvalue with positive imaginary part). Largest first; empty when A is defective.
   */
  modes: { eigenvalue: Complex; conjugatePair: boolean; share: number }[];
  points: ResidualPointer;
}

/**
 * Which outputs carry a loop's residual, and how it projects on the model's modes.
 *
 * - Output energy: `z̄_j = r̄_j / σ_j` with `r̄` the window mean; share_j = `z̄_j² / Σ_k z̄_k²`.
 * - State-space residual: the weighted least-squares state `r_x = (S C)⁺ S r̄`, `S = diag(1/σ)`
 *   (Moore–Penrose pseudo-inverse); when C has full row rank this is `C⁺ r̄`.
 * - Modal projection: `α_i = v_iᵀ r_x` with left eigenvectors normalised so `v_iᵀ w_i = 1` and unit
 *   right eigenvectors `w_i`, so `r_x = Σ α_i w_i`; mode energy `|α_i|²`, a conjugate pair
 *   `2|α_i|²` (both members); share = energy / total.
 * - `process`: one mode (or pair) holds ≥ {@link PROCESS_MODE_SHARE} of the modal energy and at
 *   least two outputs move (share ≥ {@link MOVING_SIGNAL_SHARE}): the residual has the shape of the
 *   model's own dynamics. `sensor`: the loop has ≥ 2 outputs, one carries ≥
 *   {@link SENSOR_SIGNAL_SHARE} and `process` does not hold — the residual is not along a mode that
 *   would move several outputs, so one transmitter alone is the simpler explanation. Else `unclear`
 *   (also with one output, or a zero residual).
 *
 * @throws RangeError on mismatched shapes, an empty window, non-finite residuals or σ ≤ 0
 */
export function residualDirection(input: ResidualDirectionInput): ResidualDirectionResult {
  const { n, C, p } = checkShapes(input);
  const meanResidual = windowMean(input.residuals, p);
  const z = meanResidual.map((r, j) => r / input.sigma[j]);
  const signals = shares(z.map((v) => v * v)).map((share, index) => ({ index, share }));
  signals.sort((a, b) => b.share - a.share);
  const modes = modalShares(input.A, C, z, input.sigma, n);
  return { meanResidual, signals, modes, points: classify(signals, modes, p) };
}

function checkShapes(input: ResidualDirectionInput): { n: number; C: Matrix; p: number } {
  const where = 'residualDirection';
  const n = assertSquare(where, 'A', input.A);
  const C = input.C ?? identity(n);
  const p = assertColumns(where, 'C', C, n, 'one column per state');
  assertVector(where, 'sigma', input.sigma, p);
  input.sigma.forEach((s, j) => {
    if (!(s > 0) || !Number.isFinite(s)) throw new RangeError(`${where}: sigma[${j}] must be > 0, got ${s}`);
  });
  if (!Array.isArray(input.residuals) || input.residuals.length === 0) {
    throw new RangeError(`${where}: residuals must hold at least one residual vector`);
  }
  input.residuals.forEach((r, k) => {
    assertVector(where, `residuals[${k}]`, r, p);
    if (!r.every(Number.isFinite)) throw new RangeError(`${where}: residuals[${k}] has a non-finite value`);
  });
  return { n, C, p };
}

function windowMean(residuals: number[][], p: number): number[] {
  const sum = new Array<number>(p).fill(0);
  for (const r of residuals) for (let j = 0; j < p; j++) sum[j] += r[j];
  return sum.map((s) => s / residuals.length);
}

/** Each entry over the total; all zero when the total is zero. */
function shares(energies: number[]): number[] {
  const total = energies.reduce((s, e) => s + e, 0);
  return energies.map((e) => (total > 0 ? e / total : 0));
}

function modalShares(A: Matrix, C: Matrix, z: number[], sigma: number[], n: number): ResidualDirectionResult['modes'] {
  if (eigenSystem(A).defective) return [];
  const weighted = new MlMatrix(C.map((row, j) => row.map((c) => c / sigma[j])));
  const rx = pseudoInverse(weighted).mmul(MlMatrix.columnVector(z)).to1DArray();
  if (rx.length !== n) throw new Error('residualDirection: pseudo-inverse has the wrong shape');
  const contributions = modalDecomposition(A, rx, 0);
  const energies = contributions.map(
    ({ coefficient: a, conjugatePair }) => (conjugatePair ? 2 : 1) * (a.re ** 2 + a.im ** 2),
  );
  const modeShares = shares(energies);
  return contributions
    .map((m, i) => ({ eigenvalue: { ...m.eigenvalue }, conjugatePair: m.conjugatePair, share: modeShares[i] }))
    .sort((a, b) => b.share - a.share);
}

function classify(
  signals: ResidualDirectionResult['signals'],
  modes: ResidualDirectionResult['modes'],
  p: number,
): ResidualPointer {
  if (p < 2 || signals[0].share === 0) return 'unclear';
  const moving = signals.filter((s) => s.share >= MOVING_SIGNAL_SHARE).length;
  if (modes.length > 0 && modes[0].share >= PROCESS_MODE_SHARE && moving >= 2) return 'process';
  if (signals[0].share >= SENSOR_SIGNAL_SHARE) return 'sensor';
  return 'unclear';
}
