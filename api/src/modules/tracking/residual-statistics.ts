/**
 * Running residual statistics per output (Welford's online mean and M2; Welford, Technometrics
 * 1962) and the residual band: the loop's configured band per output when set, else three running
 * standard deviations once enough residuals have been seen.
 */
export const BAND_SIGMAS = 3;
export const MIN_RESIDUALS_FOR_BAND = 30;

export interface ResidualStatistics {
  count: number;
  mean: number[];
  m2: number[];
}

export const emptyStatistics = (outputs: number): ResidualStatistics => ({
  count: 0,
  mean: new Array<number>(outputs).fill(0),
  m2: new Array<number>(outputs).fill(0),
});

/** Adds one residual vector in place. */
export function addResidual(stats: ResidualStatistics, residual: number[]): void {
  stats.count += 1;
  for (let i = 0; i < residual.length; i++) {
    const delta = residual[i] - stats.mean[i];
    stats.mean[i] += delta / stats.count;
    stats.m2[i] += delta * (residual[i] - stats.mean[i]);
  }
}

/** The band of each output: configured (a positive number) or 3 running sd; null while unknown. */
export function residualBands(
  stats: ResidualStatistics,
  configured: (number | null)[] | null,
  outputs: number,
): (number | null)[] {
  return Array.from({ length: outputs }, (_, i) => {
    const fixed = configured?.[i];
    if (typeof fixed === 'number' && fixed > 0) return fixed;
    if (stats.count < MIN_RESIDUALS_FOR_BAND) return null;
    const sd = Math.sqrt(stats.m2[i] / (stats.count - 1));
    return sd > 0 ? BAND_SIGMAS * sd : null;
  });
}

/** max_i |r_i| / band_i over the outputs that have a band; null when none has one. */
export function worstBandFraction(residual: number[], bands: (number | null)[]): number | null {
  let worst: number | null = null;
  residual.forEach((r, i) => {
    const band = bands[i];
    if (band !== null) worst = Math.max(worst ?? 0, Math.abs(r) / band);
  });
  return worst;
}
