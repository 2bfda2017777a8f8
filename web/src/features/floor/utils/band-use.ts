/**
 * The worst residual as a share of its band: max over outputs of |r_i| / band_i, from a live
 * residual and the bands, or null when no band is known for any output with a residual.
 */
export function worstBandFraction(
  residual: readonly (number | null)[] | null | undefined,
  bands: readonly (number | null)[] | undefined,
): number | null {
  if (!residual || !bands) return null;
  let worst: number | null = null;
  residual.forEach((r, i) => {
    const band = bands[i];
    if (r === null || band === null || band === undefined || band <= 0) return;
    worst = Math.max(worst ?? 0, Math.abs(r) / band);
  });
  return worst;
}

/** `38 %`, `140 %`: whole percent, as a person compares it with 100. */
export function percentOfBand(fraction: number): string {
  return `${Math.round(fraction * 100)} %`;
}
