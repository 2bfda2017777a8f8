import { eigenSystem, unitaryEquivalentCondition, DEFECTIVE_CONDITION, type EigenSystem } from './eigen.js';
import { assertSquare } from './shape.js';
import type { Complex, Matrix } from './types.js';

/** One eigenvalue of A read as a mode of the sampled loop. */
export interface Mode {
  eigenvalue: Complex;
  /** |λ|, the factor by which the mode shrinks (or grows) per sample. */
  magnitude: number;
  /** `−T / ln|λ|` in seconds for 0 < |λ| < 1, else `null`. */
  timeConstantS: number | null;
  /** `|s|` in rad/s of the equivalent continuous pole `s = ln(λ)/T` (principal branch); `null` for λ = 0. */
  naturalFrequencyRadS: number | null;
  /** `−Re(s)/|s|`; `null` for λ = 0 and for λ = 1 (s = 0). */
  dampingRatio: number | null;
  /** `2π / |arg λ|` samples per oscillation for complex or negative λ, else `null`. */
  periodSamples: number | null;
}

/** Whether free responses decay (`stable`), stay bounded (`marginal`) or grow (`unstable`). */
export type Stability = 'stable' | 'marginal' | 'unstable';

/** Result of {@link analyzeModes}: the spectrum of A read as modes of the sampled loop. */
export interface ModeAnalysis {
  /** ρ(A) = max |λ|. */
  spectralRadius: number;
  stability: Stability;
  /** True when the eigenvector matrix is numerically singular (see `eigenvectorCondition`). */
  defective: boolean;
  /** 2-norm condition of the unit-column eigenvector matrix, capped at 1/ε; defective above 1e6. */
  eigenvectorCondition: number;
  /** Sorted by magnitude, largest (slowest) first; ties by real part, then imaginary part, descending. */
  modes: Mode[];
}

/**
 * Distance from the unit circle inside which a mode counts as on it. A repeated eigenvalue is only
 * found to about √ε ≈ 1e-8 (a Jordan block of size m to ε^(1/m)), so a tighter test would call a
 * defective integrator stable or unstable by the luck of rounding.
 */
export const STABILITY_TOLERANCE = 1e-6;

/** Eigenvalues closer than this to an on-circle eigenvalue are checked together for a Jordan block. */
const CLUSTER_RADIUS = 1e-3;

/**
 * Modes and stability of `x(k+1) = A x(k)` sampled every `samplePeriodS` seconds.
 *
 * - stable: ρ < 1 − tol; unstable: ρ > 1 + tol, or an eigenvalue within tol of the unit circle whose
 *   cluster of eigenvectors is numerically dependent (a Jordan block on the circle grows like k);
 *   marginal otherwise.
 * - Continuous equivalents use `s = ln(λ)/T` (principal branch), as for a zero-order-hold model.
 *
 * @param A - n×n state matrix
 * @param samplePeriodS - sample period T in seconds (> 0)
 * @param tolerance - distance from the unit circle treated as on it (default 1e-6)
 */
export function analyzeModes(A: Matrix, samplePeriodS: number, tolerance = STABILITY_TOLERANCE): ModeAnalysis {
  assertSquare('analyzeModes', 'A', A);
  if (!(samplePeriodS > 0) || !Number.isFinite(samplePeriodS)) {
    throw new RangeError(`analyzeModes: samplePeriodS must be a positive number of seconds, got ${samplePeriodS}`);
  }
  const system = eigenSystem(A);
  const modes = system.values.map((v) => describeMode(v, samplePeriodS)).sort(byMagnitudeDescending);
  const spectralRadius = modes[0].magnitude;
  return {
    spectralRadius,
    stability: classify(system, spectralRadius, tolerance),
    defective: system.defective,
    eigenvectorCondition: system.condition,
    modes,
  };
}

/** Time constant, frequency, damping and period of one eigenvalue (see {@link Mode}). */
export function describeMode(eigenvalue: Complex, samplePeriodS: number): Mode {
  const magnitude = Math.hypot(eigenvalue.re, eigenvalue.im);
  const angle = Math.atan2(eigenvalue.im, eigenvalue.re);
  const oscillates = eigenvalue.im !== 0 || eigenvalue.re < 0;
  // equivalent continuous pole s = ln(λ)/T, principal branch
  const sRe = Math.log(magnitude) / samplePeriodS;
  const sAbs = Math.hypot(sRe, angle / samplePeriodS);
  return {
    eigenvalue: { re: eigenvalue.re, im: eigenvalue.im },
    magnitude,
    timeConstantS: magnitude > 0 && magnitude < 1 ? -samplePeriodS / Math.log(magnitude) : null,
    naturalFrequencyRadS: magnitude > 0 ? sAbs : null,
    dampingRatio: magnitude > 0 && sAbs > 0 ? -sRe / sAbs : null,
    periodSamples: oscillates ? (2 * Math.PI) / Math.abs(angle) : null,
  };
}

function byMagnitudeDescending(a: Mode, b: Mode): number {
  return b.magnitude - a.magnitude || b.eigenvalue.re - a.eigenvalue.re || b.eigenvalue.im - a.eigenvalue.im;
}

function classify(system: EigenSystem, spectralRadius: number, tolerance: number): Stability {
  if (spectralRadius < 1 - tolerance) return 'stable';
  if (spectralRadius > 1 + tolerance) return 'unstable';
  const { values } = system;
  for (const v of values) {
    if (Math.abs(Math.hypot(v.re, v.im) - 1) > tolerance) continue;
    const cluster = values.flatMap((w, j) => (Math.hypot(w.re - v.re, w.im - v.im) <= CLUSTER_RADIUS ? [j] : []));
    if (cluster.length < 2) continue;
    const columns = withPartners(cluster, values);
    if (unitaryEquivalentCondition(system.basis, values, columns) > DEFECTIVE_CONDITION) return 'unstable';
  }
  return 'marginal';
}

/** A pair is stored as two real columns; a cluster that holds one member of a pair needs both. */
function withPartners(cluster: number[], values: Complex[]): number[] {
  const columns = new Set<number>();
  for (const j of cluster) {
    columns.add(j);
    if (values[j].im > 0) columns.add(j + 1);
    if (values[j].im < 0) columns.add(j - 1);
  }
  return [...columns].sort((a, b) => a - b);
}
