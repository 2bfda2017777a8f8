import type { VersionBacktest } from '../../contracts/backtests.js';

type Run = VersionBacktest['oneStep'];

const percent = (fit: number | null) => (fit === null ? 'no fit (constant signal)' : `${fit.toFixed(1)} %`);

/** "A and B", "A, B and C". */
function listed(parts: string[]): string {
  return parts.length <= 1 ? (parts[0] ?? '') : `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

const fits = (run: Run, withNames: boolean) =>
  listed(run.outputs.map((o) => (withNames ? `${o.name} ${percent(o.fitPercent)}` : percent(o.fitPercent))));

const alerts = (n: number) => `${n} alert${n === 1 ? '' : 's'}`;

/**
 * A version's own figures in one sentence, for evidence from a backtest without a comparison (no
 * active version took part), e.g. "Version 4 fits Level 98.7 % one step ahead (91.2 % in free run)
 * and would have raised 3 alerts in 7.0 days: 0.43 a day against a target of 144."
 */
export function ownFiguresVerdict(version: VersionBacktest): string {
  const { replay } = version;
  const perDay = replay.perDay >= 10 ? replay.perDay.toFixed(0) : replay.perDay.toPrecision(2);
  const sentence =
    `Version ${version.versionNumber} fits ${fits(version.oneStep, true)} one step ahead ` +
    `(${fits(version.freeRun, false)} in free run) and would have raised ${alerts(replay.total)} in ` +
    `${replay.days.toFixed(1)} days: ${perDay} a day against a target of ${replay.targetPerDay}.`;
  return version.diverged ? `${sentence} Its prediction diverged: the figures stop where it did.` : sentence;
}
