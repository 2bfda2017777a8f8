import { chiSquareQuantile } from './chi-square.js';

/**
 * Model fit figures from L. Ljung, System Identification: Theory for the User, 2nd ed., 1999,
 * ch. 16 (model validation): the normalised-RMSE fit and the residual whiteness test (autocorrelation of the
 * residuals with a 95 % band).
 */

/**
 * Fit in percent, `100 · (1 − ‖y − ŷ‖ / ‖y − ȳ‖)`: 100 for a perfect prediction, 0 for predicting
 * the mean, negative when worse than the mean.
 *
 * @param measured - measured signal y (any unit; an array or a typed array)
 * @param predicted - predicted signal ŷ (same unit and length)
 * @returns the fit, or `null` when the measured signal is constant (the fit is undefined)
 */
export function fitPercent(measured: ArrayLike<number>, predicted: ArrayLike<number>): number | null {
  const N = measured.length;
  if (N !== predicted.length || N === 0) {
    throw new RangeError(
      `fitPercent: measured and predicted must be non-empty and equally long, got ${N} and ${predicted.length}`,
    );
  }
  let sum = 0;
  for (let t = 0; t < N; t++) sum += measured[t];
  const mean = sum / N;
  let error = 0;
  let spread = 0;
  for (let t = 0; t < N; t++) {
    error += (measured[t] - predicted[t]) ** 2;
    spread += (measured[t] - mean) ** 2;
  }
  if (spread === 0) return null;
  return 100 * (1 - Math.sqrt(error) / Math.sqrt(spread));
}

/** Sample autocorrelation of a residual and the whiteness verdict. */
export interface ResidualAutocorrelation {
  /** r(τ) for τ = 0 … maxLag; r(0) = 1. */
  correlation: number[];
  /** Half-width of the 95 % band for a white residual, 1.96/√N. */
  band: number;
  /** Lags τ ≥ 1 where |r(τ)| exceeds the band (for the chart: about 1 in 20 does by chance). */
  lagsOutside: number[];
  /** Ljung's portmanteau statistic ζ = N Σ_{τ=1}^{M} r(τ)², M = maxLag. */
  statistic: number;
  /** Its 95 % limit for a white residual, the χ²(M) quantile at 0.95. */
  limit: number;
  /** True when ζ ≤ limit: the residual passes the whiteness test at the 5 % level. */
  white: boolean;
}

/**
 * Normalised autocorrelation `r(τ) = R(τ)/R(0)` with `R(τ) = (1/N) Σ_{t=τ}^{N−1} ε(t) ε(t−τ)`
 * (no mean removed, as in Ljung: a biased residual should fail the test). For a white residual
 * each r(τ), τ ≥ 1, is approximately N(0, 1/N), hence the band ±1.96/√N for one lag. The verdict
 * judges the lags together, since with M lags about M/20 leave the band by chance: ζ = N Σ r(τ)²
 * is asymptotically χ²(M) for a white residual (Ljung, 2nd ed., 1999, §16.6, eq. 16.59 ff.;
 * Box & Pierce 1970), and the residual counts as white when ζ stays under the 95 % quantile.
 *
 * @param residual - ε(0) … ε(N−1) (an array or a typed array)
 * @param maxLag - largest lag, integer in 1 … N−1
 */
export function residualAutocorrelation(residual: ArrayLike<number>, maxLag: number): ResidualAutocorrelation {
  const N = residual.length;
  if (!Number.isInteger(maxLag) || maxLag < 1 || maxLag >= N) {
    throw new RangeError(`residualAutocorrelation: maxLag must be an integer in 1 … ${N - 1}, got ${maxLag}`);
  }
  const covariance = (lag: number): number => {
    let s = 0;
    for (let t = lag; t < N; t++) s += residual[t] * residual[t - lag];
    return s / N;
  };
  const r0 = covariance(0);
  const correlation = Array.from({ length: maxLag + 1 }, (_, lag) =>
    r0 > 0 ? covariance(lag) / r0 : lag === 0 ? 1 : 0,
  );
  const band = 1.96 / Math.sqrt(N);
  const lagsOutside = correlation.flatMap((r, lag) => (lag > 0 && Math.abs(r) > band ? [lag] : []));
  let sum = 0;
  for (let lag = 1; lag <= maxLag; lag++) sum += correlation[lag] ** 2;
  const statistic = N * sum;
  const limit = chiSquareQuantile(0.95, maxLag);
  return { correlation, band, lagsOutside, statistic, limit, white: statistic <= limit };
}
