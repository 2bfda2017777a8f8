/** Numbers as an engineer reads them: a few significant digits, a real minus sign, no noise. */

const MINUS = '−';
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

function withMinus(text: string): string {
  return text.replace(/^-/, MINUS);
}

export function formatNumber(value: number | null | undefined, significant = 4): string {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  if (!Number.isFinite(value)) return value > 0 ? '∞' : `${MINUS}∞`;
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e6) {
    return withMinus(String(Number(value.toPrecision(significant))));
  }
  const [mantissa, exponent] = value.toExponential(Math.max(0, significant - 2)).split('e');
  const power = String(Number(exponent)).replace(/./g, (c) => SUPERSCRIPT[c] ?? c);
  return `${withMinus(String(Number(mantissa)))} × 10${power}`;
}

/** `0.982`, `0.95 ± 0.12i` for a conjugate pair (pass the member with positive imaginary part). */
export function formatEigenvalue(value: { re: number; im: number }, significant = 4): string {
  if (Math.abs(value.im) < 1e-12) return formatNumber(value.re, significant);
  const imaginary = `${formatNumber(Math.abs(value.im), significant)}i`;
  return `${formatNumber(value.re, significant)} ± ${imaginary}`;
}

/** A duration in the unit a person would say: `45 s`, `3.6 min`, `5.2 h`, `3.1 d`. */
export function formatDuration(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return '—';
  if (seconds < 1) return `${formatNumber(seconds, 2)} s`;
  if (seconds < 120) return `${formatNumber(seconds, seconds < 10 ? 2 : 3)} s`;
  if (seconds < 3600) return `${formatNumber(seconds / 60, 2)} min`;
  if (seconds < 48 * 3600) return `${formatNumber(seconds / 3600, 2)} h`;
  return `${formatNumber(seconds / 86_400, 2)} d`;
}

export function formatSamples(samples: number | null | undefined): string {
  if (samples === null || samples === undefined || !Number.isFinite(samples)) return '—';
  const rounded = Number(samples.toPrecision(3));
  return `${withMinus(String(rounded))} ${rounded === 1 ? 'sample' : 'samples'}`;
}

export function plural(count: number, word: string, pluralWord = `${word}s`): string {
  return `${count} ${count === 1 ? word : pluralWord}`;
}
