import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { CORRECTION_WORDS } from '../../models/components/correction-words';
import { VERSION_STATUS_WORDS, VersionStatusWord } from '../../models/components/version-status-word';
import type { VersionStatus } from '../../models/types';
import type { VersionBacktest } from '../types';
import { FIT_NOTE } from '../utils/backtest-words';
import { AutocorrelationChart } from './autocorrelation-chart';
import { FitTable } from './fit-table';
import { RuleReplayView } from './rule-replay-view';

const isVersionStatus = (status: string): status is VersionStatus => status in VERSION_STATUS_WORDS;

function CorrectionLine({ result }: { result: VersionBacktest }) {
  const mode = result.oneStep.correction;
  if (mode === 'free_run') {
    return <p>This version uses no correction, so its one-step and free-run figures agree.</p>;
  }
  return (
    <p>
      One step ahead with its correction, <strong>{CORRECTION_WORDS[mode].name.toLowerCase()}</strong>:{' '}
      {CORRECTION_WORDS[mode].explanation} The free run sees the inputs only.
    </p>
  );
}

type VersionResultCardProps = {
  result: VersionBacktest;
  /** The version's status now (it may have moved on since the backtest). */
  statusNow: string;
  timeZone: string;
  children?: ReactNode;
};

/** One version's figures: both replays per output, the whiteness chart, the rule replay and the suggested settings. */
export function VersionResultCard({ result, statusNow, timeZone, children }: VersionResultCardProps) {
  const title = `Version ${result.versionNumber}`;
  return (
    <section aria-label={title} className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3 text-sm">
      <h3 className="flex flex-wrap items-center gap-3 text-lg font-bold">
        <Link to={`/models/versions/${result.versionId}`} className="hover:underline">
          {title}
        </Link>
        {isVersionStatus(statusNow) ? <VersionStatusWord status={statusNow} /> : <span>{statusNow}</span>}
        {result.wasActive ? <span className="text-sm font-normal">active when the backtest ran</span> : null}
      </h3>
      {result.diverged ? (
        <p role="note" className="border-l-4 border-l-diverged pl-3 font-medium">
          The prediction of version {result.versionNumber} left the finite numbers on this recording (an unstable run);
          its figures stop there.
        </p>
      ) : null}
      <CorrectionLine result={result} />
      <p className="text-xs text-ink/75">{FIT_NOTE}. RMSE, residual mean and std in the output&apos;s unit.</p>
      <div className="grid gap-3 2xl:grid-cols-2">
        <FitTable title={`Version ${result.versionNumber}, one step ahead`} run={result.oneStep} />
        <FitTable title={`Version ${result.versionNumber}, free run`} run={result.freeRun} />
      </div>
      <div className={`grid gap-3 ${result.oneStep.outputs.length > 1 ? 'xl:grid-cols-2' : ''}`}>
        {result.oneStep.outputs.map((output) => (
          <AutocorrelationChart key={output.name} output={output} />
        ))}
      </div>
      <RuleReplayView replay={result.replay} timeZone={timeZone} />
      <section aria-label="Suggested rule settings" className="space-y-1">
        <h4 className="font-bold">Suggested rule settings</h4>
        <p>{result.suggestion.sentence}</p>
      </section>
      {children}
    </section>
  );
}
