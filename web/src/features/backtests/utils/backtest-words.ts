import type { StatusTone } from '../../../components/ui/status-word';
import { formatNumber } from '../../../lib/format-number';
import { formatInTimeZone } from '../../../lib/format-time';
import type { Autocorrelation, BacktestStatus, BacktestSummary } from '../types';

export const BACKTEST_STATUS: Record<BacktestStatus, { word: string; tone: StatusTone }> = {
  queued: { word: 'waiting to start', tone: 'none' },
  running: { word: 'running', tone: 'twin' },
  succeeded: { word: 'done', tone: 'in_step' },
  failed: { word: 'failed', tone: 'diverged' },
  cancelled: { word: 'cancelled', tone: 'stale' },
};

export const count = (n: number) => n.toLocaleString('en-GB');

/** `2025-06-01 08:00 BST to 2025-06-08 08:00 BST` on the plant's clock, or the uploaded file's name. */
export function sourceText(
  backtest: Pick<BacktestSummary, 'source' | 'from' | 'to' | 'upload'>,
  timeZone: string,
): string {
  if (backtest.source === 'upload') return `uploaded file ${backtest.upload?.fileName ?? '(name not kept)'}`;
  return `${formatInTimeZone(backtest.from, timeZone)} to ${formatInTimeZone(backtest.to, timeZone)}`;
}

/** `versions 3 and 4`, `version 4`. */
export function versionNumbersText(numbers: readonly number[]): string {
  const sorted = [...numbers].sort((a, b) => a - b);
  if (sorted.length === 1) return `version ${sorted[0]}`;
  return `versions ${sorted.slice(0, -1).join(', ')} and ${sorted[sorted.length - 1]}`;
}

/**
 * Ljung's whiteness check of a residual in words: the portmanteau N Σ r(τ)², τ = 1 … maxLag,
 * against its 95 % limit, and how many lags leave the band ±1.96/√N (L. Ljung, System
 * Identification, 2nd ed., 1999, §16.6).
 */
export function whitenessText(autocorrelation: Autocorrelation | null): string {
  if (!autocorrelation) return 'too few samples to judge';
  if (autocorrelation.negligible) return 'white (the residual is at rounding level)';
  const lags = autocorrelation.correlation.length - 1;
  const outside = autocorrelation.lagsOutside.length;
  const band = `±${formatNumber(autocorrelation.band, 2)}`;
  const test = `N·Σr² = ${formatNumber(autocorrelation.statistic, 3)}, limit ${formatNumber(autocorrelation.limit, 3)}`;
  if (!autocorrelation.white) return `not white: ${test}; ${outside} of ${lags} lags outside ${band}`;
  return outside === 0
    ? `white (${test})`
    : `white (${test}; ${outside} of ${lags} lags outside ${band}, within chance)`;
}

/** `87.34 %`; a dash when the output was constant over the range (the fit is then undefined). */
export function fitText(fitPercent: number | null): string {
  return fitPercent === null ? '—' : `${formatNumber(fitPercent, 4)} %`;
}

/** A value in the signal's unit: `0.12 mg/L`. */
export function withUnit(value: number | null, unit: string): string {
  if (value === null) return '—';
  return unit ? `${formatNumber(value, 3)} ${unit}` : formatNumber(value, 3);
}

/** `+12 points`, `−0.4 points`: a fit difference, positive when the candidate fits better. */
export function pointsText(delta: number | null): string {
  if (delta === null) return '—';
  const rounded =
    Math.abs(delta) < 2 ? formatNumber(Math.round(delta * 10) / 10, 3) : formatNumber(Math.round(delta), 4);
  return `${delta > 0 ? '+' : ''}${rounded} ${Math.abs(delta) === 1 ? 'point' : 'points'}`;
}

/** Under every verdict (the advisory caution, for backtests). */
export const BACKTEST_CAUTION =
  "Advisory: a backtest is the model's account of past data, not a guarantee of how it will track the plant. Model changes still go through the site's management-of-change process and a qualified control engineer's review.";

/** Where Ljung's fit figure comes from, beside every table of it. */
export const FIT_NOTE = 'fit = 100·(1 − ‖y − ŷ‖ / ‖y − ȳ‖), Ljung';
