/**
 * Model fit figures from L. Ljung, System Identification: Theory for the User, 2nd ed., 1999,
 * ch. 16 (model validation): the normalised-RMSE fit and the residual whiteness test (autocorrelation of the
 * residuals with a 95 % band).
 */

/**
 * Fit in percent, `100 · (1 − ‖y − ŷ‖ / ‖y − ȳ‖)`: 100 for a perfect prediction, 0 for predicting
 * the mean, negative when worse than the mean.
 *
 * @param measured - measured signal y (any unit)
 * @param predicted - predicted signal ŷ (same unit and length)
 * @returns the fit, or `null` when the measured signal is constant (the fit is undefined)
 */
export function fitPercent(measured: number[], predicted: number[]): number | null {
  if (measured.length !== predicted.length || measured.length === 0) {
    throw new RangeError(
      `fitPercent: measured and predicted must be non-empty and equally long, got ${measured.length} and ${predicted.length}`,
    );
  }
  const mean = measured.reduce((s, y) => s + y, 0) / measured.length;
  let error = 0;
  let spread = 0;
  measured.forEach((y, t) => {
    error += (y - predicted[t]) ** 2;
    spread += (y - mean) ** 2;
  });
  if (spread === 0) return null;
  return 100 * (1 - Math.sqrt(error) / Math.sqrt(spread));
}

/** Sample autocorrelation of a residual and the whiteness verdict. */
export interface ResidualAutocorrelation {
  /** r(τ) for τ = 0 … maxLag; r(0) = 1. */
  correlation: number[];
  /** Half-width of the 95 % band for a white residual, 1.96/√N. */
  band: number;
  /** Lags τ ≥ 1 where |r(τ)| exceeds the band. */
  lagsOutside: number[];
  /** True when no lag τ ≥ 1 leaves the band. */
  white: boolean;
}

/**
 * Normalised autocorrelation `r(τ) = R(τ)/R(0)` with `R(τ) = (1/N) Σ_{t=τ}^{N−1} ε(t) ε(t−τ)`
 * (no mean removed, as in Ljung: a biased residual should fail the test). For a white residual
 * each r(τ), τ ≥ 1, is approximately N(0, 1/N), hence the band ±1.96/√N.
 *
 * @param residual - ε(0) … ε(N−1)
 * @param maxLag - largest lag, integer in 1 … N−1
 */
export function residualAutocorrelation(residual: number[], maxLag: number): ResidualAutocorrelation {
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
  return { correlation, band, lagsOutside, white: lagsOutside.length === 0 };
}
