import { Link } from 'react-router';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatInTimeZone } from '../../../lib/format-time';
import { isUnfinished } from '../api/backtest-keys';
import type { BacktestSummary } from '../types';
import { sourceText, versionNumbersText } from '../utils/backtest-words';
import { BacktestProgress } from './backtest-progress';
import { BacktestStatusWord } from './backtest-status-word';

type BacktestListProps = { backtests: BacktestSummary[]; timeZone: string; mayCancel: boolean };

function Outcome({ backtest }: { backtest: BacktestSummary }) {
  if (backtest.status === 'failed')
    return <span className="text-diverged">{backtest.error ?? 'Stopped with an error.'}</span>;
  if (backtest.status === 'cancelled') return <span className="text-ink/70">Cancelled before it finished.</span>;
  if (backtest.status !== 'succeeded') return <span className="text-ink/60">when it is done</span>;
  return <>{backtest.verdict ?? 'One version only: open it for its figures.'}</>;
}

/** A loop's backtests, newest first: status in word and colour, progress with Cancel while running. */
export function BacktestList({ backtests, timeZone, mayCancel }: BacktestListProps) {
  return (
    <Table caption="Backtests of this loop, newest first">
      <thead>
        <tr>
          <Th>Backtest</Th>
          <Th>Status</Th>
          <Th>Recording</Th>
          <Th>Started by</Th>
          <Th>Verdict</Th>
        </tr>
      </thead>
      <tbody>
        {backtests.map((backtest) => {
          const versions = versionNumbersText(backtest.versions.map((v) => v.number));
          const started = formatInTimeZone(backtest.createdAt, timeZone);
          return (
            <tr key={backtest.id} className="align-top hover:bg-paper">
              <Td>
                <Link to={`/backtests/${backtest.id}`} className="font-bold hover:underline">
                  {versions.charAt(0).toUpperCase() + versions.slice(1)}
                </Link>
                {backtest.attachedTo.length ? (
                  <div className="text-xs text-ink/70">
                    evidence for {versionNumbersText(backtest.attachedTo.map((a) => a.versionNumber))}
                  </div>
                ) : null}
              </Td>
              <Td className="min-w-48">
                <BacktestStatusWord status={backtest.status} />
                {isUnfinished(backtest.status) ? (
                  <BacktestProgress
                    backtest={backtest}
                    mayCancel={mayCancel}
                    cancelLabel={`Cancel the backtest of ${versions} started ${started}`}
                  />
                ) : null}
              </Td>
              <Td className="tabular-nums">{sourceText(backtest, timeZone)}</Td>
              <Td>
                {backtest.createdBy?.name ?? '—'}
                <div className="text-xs text-ink/70 tabular-nums">{started}</div>
              </Td>
              <Td className="max-w-md">
                <Outcome backtest={backtest} />
              </Td>
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}
