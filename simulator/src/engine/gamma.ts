/**
 * Log-gamma and the regularised incomplete gamma functions, for the chi-square distribution.
 * Methods: Stirling's series after shifting the argument above 15; the power series for P(a, x) when
 * x < a + 1 and the Legendre continued fraction for Q(a, x) otherwise (W. H. Press et al., Numerical
 * Recipes, 3rd ed., §6.1–6.2).
 */

const HALF_LOG_2PI = 0.5 * Math.log(2 * Math.PI);

/** Stirling coefficients B_{2k} / (2k(2k−1)) for k = 1 … 7 (Bernoulli numbers 1/6, −1/30, …, 7/6). */
const STIRLING = [1 / 12, -1 / 360, 1 / 1260, -1 / 1680, 1 / 1188, -691 / 360360, 1 / 156];

/** ln Γ(x) for x > 0; absolute error about 1e-14 (the first omitted term is below 1e-19 at z ≥ 15). */
export function lnGamma(x: number): number {
  if (!(x > 0)) throw new RangeError(`lnGamma: x must be positive, got ${x}`);
  let shift = 0;
  let product = 1;
  let z = x;
  while (z < 15) {
    product *= z;
    z += 1;
    shift += 1;
  }
  const inverse = 1 / z;
  const inverse2 = inverse * inverse;
  let series = 0;
  let power = inverse;
  for (const coefficient of STIRLING) {
    series += coefficient * power;
    power *= inverse2;
  }
  const stirling = (z - 0.5) * Math.log(z) - z + HALF_LOG_2PI + series;
  return shift > 0 ? stirling - Math.log(product) : stirling;
}

/** Regularised lower incomplete gamma P(a, x) = γ(a, x)/Γ(a), for a > 0, x ≥ 0. */
export function gammaP(a: number, x: number): number {
  if (x <= 0) return 0;
  return x < a + 1 ? gammaSeries(a, x) : 1 - gammaContinuedFraction(a, x);
}

/** Regularised upper incomplete gamma Q(a, x) = 1 − P(a, x), accurate when it is small. */
export function gammaQ(a: number, x: number): number {
  if (x <= 0) return 1;
  return x < a + 1 ? 1 - gammaSeries(a, x) : gammaContinuedFraction(a, x);
}

/** e^{−x} x^a / Γ(a): the common prefactor, in logs to avoid overflow. */
function prefactor(a: number, x: number): number {
  return Math.exp(-x + a * Math.log(x) - lnGamma(a));
}

function gammaSeries(a: number, x: number): number {
  let term = 1 / a;
  let sum = term;
  for (let n = 1; n < 10_000; n++) {
    term *= x / (a + n);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * Number.EPSILON) break;
  }
  return sum * prefactor(a, x);
}

function gammaContinuedFraction(a: number, x: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 10_000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < Number.EPSILON) break;
  }
  return prefactor(a, x) * h;
}
