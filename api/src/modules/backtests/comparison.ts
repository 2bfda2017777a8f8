import type { z } from 'zod';
import type { BacktestComparisonSchema, VersionBacktest } from '../../contracts/backtests.js';
import type { Signal } from '../../contracts/registry.js';

export type BacktestComparison = z.infer<typeof BacktestComparisonSchema>;
type OutputDelta = BacktestComparison['outputs'][number];
type Better = BacktestComparison['better'];

/** Fit differences under this many points (of fit %) count as the same fit. */
export const SAME_FIT_POINTS = 1;

/** Outputs named one by one in the verdict; with more, only the largest difference is named. */
const NAMED_OUTPUTS = 2;

/**
 * The candidate (the newest-numbered version that was not active) against the active version of
 * the same backtest: fit differences per output (candidate − active, in points of fit %) and the
 * alerts each would have raised, with a verdict in words. Null without both.
 */
export function compareVersions(versions: VersionBacktest[], outputs: Signal[]): BacktestComparison | null {
  const active = versions.find((version) => version.wasActive);
  const candidate = versions
    .filter((version) => !version.wasActive)
    .reduce<VersionBacktest | null>(
      (newest, v) => (!newest || v.versionNumber > newest.versionNumber ? v : newest),
      null,
    );
  if (!active || !candidate) return null;
  const rows = outputs.map((signal, i) => ({
    name: signal.name,
    unit: signal.unit,
    fitDelta: fitDelta(candidate.oneStep, active.oneStep, i),
    freeRunFitDelta: fitDelta(candidate.freeRun, active.freeRun, i),
  }));
  const judged =
    candidate.diverged || active.diverged ? divergedVerdict(candidate, active) : fitVerdict(candidate, active, rows);
  return {
    candidateVersionId: candidate.versionId,
    activeVersionId: active.versionId,
    outputs: rows,
    alertsCandidate: candidate.replay.total,
    alertsActive: active.replay.total,
    ...judged,
  };
}

function fitDelta(candidate: VersionBacktest['oneStep'], active: VersionBacktest['oneStep'], i: number): number | null {
  const c = candidate.outputs[i]?.fitPercent ?? null;
  const a = active.outputs[i]?.fitPercent ?? null;
  return c === null || a === null ? null : c - a;
}

/** +1 the candidate fits better, −1 worse, 0 the same (within SAME_FIT_POINTS). */
const sideOf = (delta: number) => (delta >= SAME_FIT_POINTS ? 1 : delta <= -SAME_FIT_POINTS ? -1 : 0);

/** "12 points", "1.4 points", "1 point": whole points, one decimal under 2. */
function points(delta: number): string {
  const size = Math.abs(delta);
  const rounded = size < 2 ? Math.round(size * 10) / 10 : Math.round(size);
  return `${rounded} point${rounded === 1 ? '' : 's'}`;
}

const alertWords = (count: number) => `${count} alert${count === 1 ? '' : 's'}`;

function alertsClause(candidate: number, active: number): string {
  if (candidate === active) return `would have raised the same number of alerts (${active})`;
  return `would have raised ${alertWords(candidate)} instead of ${active}`;
}

/**
 * The evidence: one-step fit per output and the alerts replayed. Outputs pulling both ways, or fit
 * and alerts pulling apart, are `mixed`; no difference at all points to the active version, as
 * nothing speaks for a change.
 */
function betterOf(sides: number[], alertSide: number): Better {
  if (sides.includes(1) && sides.includes(-1)) return 'mixed';
  const fitSide = sides.includes(1) ? 1 : sides.includes(-1) ? -1 : 0;
  if (fitSide !== 0 && alertSide !== 0 && fitSide !== alertSide) return 'mixed';
  return (fitSide || alertSide) > 0 ? 'candidate' : 'active';
}

function fitVerdict(candidate: VersionBacktest, active: VersionBacktest, rows: OutputDelta[]) {
  const compared = rows.filter((row): row is OutputDelta & { fitDelta: number } => row.fitDelta !== null);
  const sides = compared.map((row) => sideOf(row.fitDelta));
  const alertSide = Math.sign(active.replay.total - candidate.replay.total);
  const alerts = alertsClause(candidate.replay.total, active.replay.total);
  const subject = `Version ${candidate.versionNumber}`;
  const reference = `active version ${active.versionNumber}`;
  const better = betterOf(sides, alertSide);
  if (compared.length === 0) {
    return {
      verdict: `${subject} and ${reference} have no fit to compare on this recording (each output is constant or has too few readings); ${subject.toLowerCase()} ${alerts}.`,
      better,
    };
  }
  const fits =
    rows.length <= NAMED_OUTPUTS ? namedFits(compared, rows, reference) : largestFit(compared, rows, reference);
  return { verdict: `${subject} fits ${fits} ${alerts}.`, better };
}

/** Each output: "DO 12 points better than active version 3 (one step ahead) and pH the same (within 1 point),". */
function namedFits(compared: (OutputDelta & { fitDelta: number })[], rows: OutputDelta[], reference: string): string {
  const clauses = compared.map((row, i) => {
    const side = sideOf(row.fitDelta);
    const size = points(row.fitDelta);
    if (i > 0)
      return side === 0
        ? `${row.name} the same (within ${SAME_FIT_POINTS} point)`
        : `${row.name} ${size} ${side > 0 ? 'better' : 'worse'}`;
    if (side === 0) return `${row.name} the same as ${reference} (within ${SAME_FIT_POINTS} point, one step ahead)`;
    return `${row.name} ${size} ${side > 0 ? 'better' : 'worse'} than ${reference} (one step ahead)`;
  });
  const missing = rows.filter((row) => row.fitDelta === null).map((row) => `has no fit for ${row.name} to compare`);
  const all = [...clauses, ...missing];
  return all.length === 1 ? `${all[0]} and` : `${all.join(' and ')}, and`;
}

/** Many outputs: the largest difference, and how many others pull the other way. */
function largestFit(compared: (OutputDelta & { fitDelta: number })[], rows: OutputDelta[], reference: string): string {
  const largest = compared.reduce((a, b) => (Math.abs(b.fitDelta) > Math.abs(a.fitDelta) ? b : a));
  const side = sideOf(largest.fitDelta);
  if (side === 0) {
    return `all ${compared.length} compared outputs the same as ${reference} (within ${SAME_FIT_POINTS} point, one step ahead) and`;
  }
  const against = compared.filter((row) => sideOf(row.fitDelta) === -side).length;
  const others =
    against === 0
      ? ''
      : `, while ${against === 1 ? '1 other output fits' : `${against} other outputs fit`} ${side > 0 ? 'worse' : 'better'},`;
  return `${largest.name} ${points(largest.fitDelta)} ${side > 0 ? 'better' : 'worse'} than ${reference} (one step ahead; the largest difference of ${rows.length} outputs)${others} and`;
}

/** A version whose predicted state left the finite numbers: its figures stop there, so the fits are not comparable. */
function divergedVerdict(candidate: VersionBacktest, active: VersionBacktest): { verdict: string; better: Better } {
  const why = 'its predicted state leaves the finite numbers, so its figures stop there';
  const c = candidate.versionNumber;
  const a = active.versionNumber;
  if (candidate.diverged && active.diverged) {
    return {
      verdict: `Version ${c} and active version ${a} both diverge on this recording: their predicted states leave the finite numbers, so neither's figures cover the whole range.`,
      better: 'mixed',
    };
  }
  if (candidate.diverged) {
    return {
      verdict: `Version ${c} diverges on this recording: ${why}. Active version ${a} stays finite and would have raised ${alertWords(active.replay.total)}.`,
      better: 'active',
    };
  }
  return {
    verdict: `Active version ${a} diverges on this recording: ${why}. Version ${c} stays finite and would have raised ${alertWords(candidate.replay.total)}.`,
    better: 'candidate',
  };
}
