/**
 * Durations and counts in plain words for the rule editor: "9 days", "3.6 hours", "1 minute",
 * "120 years". Two significant figures at most; whole numbers from 10 up.
 */
const UNITS: { name: string; seconds: number; below: number }[] = [
  { name: 'second', seconds: 1, below: 90 },
  { name: 'minute', seconds: 60, below: 90 * 60 },
  { name: 'hour', seconds: 3600, below: 48 * 3600 },
  { name: 'day', seconds: 86_400, below: 730 * 86_400 },
  { name: 'year', seconds: 365.25 * 86_400, below: Infinity },
];

const MILLION_YEARS_S = 1e6 * 365.25 * 86_400;

/** A positive count rounded to at most two significant figures, with thousands separators. */
export function roundedCount(value: number): string {
  if (value >= 10) {
    const magnitude = 10 ** (Math.floor(Math.log10(value)) - 1);
    return (Math.round(value / magnitude) * magnitude).toLocaleString('en-GB');
  }
  const rounded = Math.round(value * 10) / 10;
  return rounded.toLocaleString('en-GB', { maximumFractionDigits: 1 });
}

const unitWord = (count: string, unit: string) => `${count} ${unit}${count === '1' ? '' : 's'}`;

export function plainDuration(seconds: number): string {
  if (seconds >= MILLION_YEARS_S) return 'more than a million years';
  const unit = UNITS.find((u) => seconds < u.below) ?? UNITS[UNITS.length - 1];
  return unitWord(roundedCount(seconds / unit.seconds), unit.name);
}

export const plainSamples = (samples: number) => unitWord(roundedCount(samples), 'sample');
