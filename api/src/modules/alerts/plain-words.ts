import type { Complex } from '@shadowloop/simulator/engine';

/** Decimals that show about three significant digits of the largest of some values (0 … 6). */
export function decimalsFor(...values: (number | null | undefined)[]): number {
  const largest = Math.max(0, ...values.filter((v): v is number => v != null && Number.isFinite(v)).map(Math.abs));
  if (largest === 0) return 2;
  return Math.min(6, Math.max(0, 2 - Math.floor(Math.log10(largest))));
}

/** "1.42 mg/L"; without a unit just the number. */
export function quantity(value: number, unit: string, decimals = decimalsFor(value)): string {
  const text = value.toFixed(decimals);
  return unit ? `${text} ${unit}` : text;
}

/** Seconds in the unit a person reads best: "45 s", "3.7 min", "2.1 h", "1.5 days". */
export function duration(seconds: number): string {
  const round = (v: number) => (v >= 10 ? v.toFixed(0) : v.toFixed(1));
  if (seconds < 90) return `${round(seconds)} s`;
  if (seconds < 5400) return `${round(seconds / 60)} min`;
  if (seconds < 172_800) return `${round(seconds / 3600)} h`;
  return `${round(seconds / 86_400)} days`;
}

/** "0.982" for a real eigenvalue, "0.90 ± 0.12i" for a conjugate pair. */
export function eigenvalueText(value: Complex): string {
  if (value.im === 0) return value.re.toFixed(3);
  return `${value.re.toFixed(3)} ± ${Math.abs(value.im).toFixed(3)}i`;
}

/** "1 sample", "3 samples". */
export const samples = (count: number) => `${count} sample${count === 1 ? '' : 's'}`;
