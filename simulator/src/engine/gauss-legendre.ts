/** Nodes and weights of an m-point Gauss–Legendre rule on [a, b]. */
export interface QuadratureRule {
  nodes: number[];
  weights: number[];
}

/**
 * m-point Gauss–Legendre rule on [a, b], exact for polynomials of degree 2m − 1. Nodes are the
 * roots of the Legendre polynomial P_m, found by Newton's method from `cos(π(i − ¼)/(m + ½))`, with
 * weights `2 / ((1 − x²) P_m'(x)²)` (W. H. Press et al., Numerical Recipes, 3rd ed., §4.6).
 */
export function gaussLegendre(m: number, a: number, b: number): QuadratureRule {
  if (!Number.isInteger(m) || m < 1) throw new RangeError(`gaussLegendre: m must be a positive integer, got ${m}`);
  const half = (b - a) / 2;
  const middle = (a + b) / 2;
  const nodes = new Array<number>(m);
  const weights = new Array<number>(m);
  for (let i = 0; i < Math.ceil(m / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (m + 0.5));
    let derivative = legendreDerivative(m, x);
    for (let iteration = 0; iteration < 100; iteration++) {
      const dx = legendre(m, x)[0] / derivative;
      x -= dx;
      derivative = legendreDerivative(m, x);
      if (Math.abs(dx) <= 1e-15) break;
    }
    const w = (2 * half) / ((1 - x * x) * derivative * derivative);
    nodes[i] = middle - half * x;
    nodes[m - 1 - i] = middle + half * x;
    weights[i] = w;
    weights[m - 1 - i] = w;
  }
  return { nodes, weights };
}

/** P_m'(x) = m (x P_m − P_{m−1}) / (x² − 1). */
function legendreDerivative(m: number, x: number): number {
  const [pm, pm1] = legendre(m, x);
  return (m * (x * pm - pm1)) / (x * x - 1);
}

/** [P_m(x), P_{m−1}(x)] by the three-term recurrence. */
function legendre(m: number, x: number): [number, number] {
  let previous = 1;
  let current = x;
  if (m === 0) return [1, 0];
  for (let j = 2; j <= m; j++) {
    const next = ((2 * j - 1) * x * current - (j - 1) * previous) / j;
    previous = current;
    current = next;
  }
  return [current, previous];
}
