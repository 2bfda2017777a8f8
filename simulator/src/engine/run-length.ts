import { Matrix as MlMatrix, solve } from 'ml-matrix';
import { gaussLegendre } from './gauss-legendre.js';
import { normalCdf, normalPdf } from './normal.js';

/** A CUSUM design and the process shift at which to evaluate it (standardised units). */
export interface CusumArlQuery {
  /** Reference value k (standard deviations). */
  k: number;
  /** Decision interval h (standard deviations, > 0). */
  h: number;
  /** Mean shift of the standardised residual (standard deviations); 0 for the in-control ARL. Default 0. */
  shift?: number;
  /** Both sums (the product's CUSUM rule) or only the upper one. Default true. */
  twoSided?: boolean;
}

/** Quadrature nodes per unit of h; 24/σ gives about 10 significant digits for h ≤ 10. */
const NODES_PER_UNIT_H = 24;
const MIN_NODES = 48;
const MAX_NODES = 400;

/**
 * Average run length of a CUSUM on N(shift, 1) residuals: the expected number of samples, counting
 * the signalling one, from a zero start until a sum exceeds h. It is the expected interval between
 * false alerts (shift 0) or the expected detection delay (shift ≠ 0).
 *
 * One-sided: the ARL function L(x) of the upper sum started at x solves the integral equation
 * `L(x) = 1 + L(0) Φ(k − x − δ) + ∫_0^h L(y) φ(y − x + k − δ) dy` (K. W. Kemp, J. Roy. Stat. Soc. B 1961;
 * D. Brook and D. A. Evans, Biometrika 59, 1972), solved by the Nyström method with a Gauss–Legendre
 * rule on [0, h]. Two-sided: `1/ARL = 1/ARL⁺ + 1/ARL⁻` (J. M. Lucas and R. B. Crosier, Technometrics
 * 24(3), 1982), where ARL⁻ is the upper-sum ARL at shift −δ.
 */
export function cusumArl(query: CusumArlQuery): number {
  const { k, h, shift = 0, twoSided = true } = query;
  if (!Number.isFinite(k)) throw new RangeError(`cusumArl: k must be a finite number, got ${k}`);
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError(`cusumArl: h must be a positive number, got ${h}`);
  if (!Number.isFinite(shift)) throw new RangeError(`cusumArl: shift must be a finite number, got ${shift}`);
  const upper = oneSidedArl(k, h, shift);
  if (!twoSided) return upper;
  const lower = oneSidedArl(k, h, -shift);
  return 1 / (1 / upper + 1 / lower);
}

function oneSidedArl(k: number, h: number, shift: number): number {
  const m = Math.min(MAX_NODES, Math.max(MIN_NODES, Math.ceil(NODES_PER_UNIT_H * h)));
  const { nodes, weights } = gaussLegendre(m, 0, h);
  const points = [0, ...nodes];
  // unknowns: L(0), L(y_1) … L(y_m); one equation per point
  const system = new MlMatrix(m + 1, m + 1);
  points.forEach((x, i) => {
    system.set(i, 0, (i === 0 ? 1 : 0) - normalCdf(k - x - shift));
    for (let j = 1; j <= m; j++) {
      system.set(i, j, (i === j ? 1 : 0) - weights[j - 1] * normalPdf(nodes[j - 1] - x + k - shift));
    }
  });
  const ones = MlMatrix.ones(m + 1, 1);
  return solve(system, ones).get(0, 0);
}

/**
 * Expected number of samples until `r` consecutive exceedances, each independent with probability p:
 * `(1 − p^r) / ((1 − p) p^r)` (W. Feller, An Introduction to Probability Theory and Its Applications,
 * vol. 1, 3rd ed., 1968, §XIII.7). For a band rule with a persistence of r samples this is the
 * expected interval between false alerts (p the false-exceedance probability per sample).
 *
 * @param p - exceedance probability per sample, in [0, 1]; p = 0 gives +∞
 * @param r - consecutive exceedances required, integer ≥ 1
 */
export function persistenceArl(p: number, r: number): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`persistenceArl: p must be in [0, 1], got ${p}`);
  if (!Number.isInteger(r) || r < 1) throw new RangeError(`persistenceArl: r must be an integer ≥ 1, got ${r}`);
  if (p === 0) return Infinity;
  if (p === 1) return r;
  const pr = p ** r;
  return (1 - pr) / ((1 - p) * pr);
}
