import { gammaP, gammaQ, lnGamma } from './gamma.js';
import { normalQuantile } from './normal.js';

/** Chi-square distribution function with `dof` degrees of freedom: P(dof/2, x/2). */
export function chiSquareCdf(x: number, dof: number): number {
  assertDof('chiSquareCdf', dof);
  return gammaP(dof / 2, x / 2);
}

/**
 * Chi-square quantile: the x with `P(χ²_dof ≤ x) = p` (so p = 0.95 gives the 5 % upper critical
 * value used for an NIS alarm). Starts from the Wilson–Hilferty cube-root approximation and refines
 * by Newton's method on the lower (p ≤ 0.5) or upper tail, kept inside a bracket by bisection.
 *
 * @param p - lower-tail probability in [0, 1)
 * @param dof - degrees of freedom (> 0; for the NIS, the number of outputs)
 */
export function chiSquareQuantile(p: number, dof: number): number {
  assertDof('chiSquareQuantile', dof);
  if (!(p >= 0 && p < 1)) throw new RangeError(`chiSquareQuantile: p must be in [0, 1), got ${p}`);
  if (p === 0) return 0;
  const a = dof / 2;
  const upper = p > 0.5;
  // residual of the tail that is small, signed so that it increases with x
  const residual = upper ? (x: number) => 1 - p - gammaQ(a, x / 2) : (x: number) => gammaP(a, x / 2) - p;
  const logDensityConstant = -a * Math.LN2 - lnGamma(a);
  const density = (x: number) => Math.exp((a - 1) * Math.log(x) - x / 2 + logDensityConstant);
  let x = startingPoint(p, dof, a);
  let low = 0;
  let high = Infinity;
  for (let i = 0; i < 200; i++) {
    const r = residual(x);
    if (r === 0) return x;
    if (r < 0) low = x;
    else high = x;
    let next = x - r / density(x);
    if (!(next > low && next < high)) next = Number.isFinite(high) ? (low + high) / 2 : 2 * x;
    if (Math.abs(next - x) <= 1e-15 * x) return next;
    x = next;
  }
  return x;
}

function startingPoint(p: number, dof: number, a: number): number {
  const v = 2 / (9 * dof);
  const wilsonHilferty = dof * (1 - v + normalQuantile(p) * Math.sqrt(v)) ** 3;
  if (wilsonHilferty > 0.1 * dof) return wilsonHilferty;
  // lower tail: P(a, x/2) ≈ (x/2)^a / Γ(a+1)
  return 2 * Math.exp((Math.log(p) + lnGamma(a + 1)) / a);
}

function assertDof(where: string, dof: number): void {
  if (!(dof > 0) || !Number.isFinite(dof)) throw new RangeError(`${where}: dof must be a positive number, got ${dof}`);
}
