import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import type { Loop } from '../../loops/api/get-loops';
import { loopVersionsQueryOptions } from '../../models/api/get-loop-versions';
import { useStartBacktest } from '../api/start-backtest';
import type { BacktestSource } from '../types';
import { defaultVersionIds } from '../utils/version-defaults';
import { RangeSource } from './range-source';
import { UploadSource } from './upload-source';
import { VersionCheckboxes } from './version-checkboxes';

const SOURCES = [
  { key: 'range', label: 'Stored readings' },
  { key: 'upload', label: 'Upload a CSV' },
] as const;

/** Versions, then the recording (a range of stored readings or a file); starting opens the backtest's page. */
export function NewBacktestPanel({ loop }: { loop: Loop }) {
  const versions = useQuery(loopVersionsQueryOptions(loop.id));
  const [picked, setPicked] = useState<string[] | null>(null);
  const [source, setSource] = useState<BacktestSource['source']>('range');
  const [versionProblem, setVersionProblem] = useState<string | undefined>();
  const start = useStartBacktest(loop.id);
  const navigate = useNavigate();
  const chosen = picked ?? defaultVersionIds(versions.data ?? []);

  const run = (recording: BacktestSource) => {
    if (chosen.length === 0) {
      setVersionProblem('Tick at least one model version to replay.');
      return;
    }
    setVersionProblem(undefined);
    start.mutate(
      { ...recording, versionIds: chosen },
      { onSuccess: (created) => navigate(`/backtests/${created.id}`) },
    );
  };

  return (
    <section aria-label="New backtest" className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3">
      <h2 className="text-lg font-bold">New backtest</h2>
      {versions.isError ? <ErrorNotice error={versions.error} onRetry={() => void versions.refetch()} /> : null}
      {versions.data ? (
        <VersionCheckboxes
          loopId={loop.id}
          versions={versions.data}
          picked={chosen}
          onChange={(next) => {
            setPicked(next);
            setVersionProblem(undefined);
          }}
          error={versionProblem}
        />
      ) : (
        <p className="h-6 w-96 animate-pulse rounded-sm bg-rule/60" role="status" aria-label="Loading the versions" />
      )}
      <fieldset className="text-sm">
        <legend className="font-medium">Recording</legend>
        <div className="mt-1 flex flex-wrap gap-4">
          {SOURCES.map((s) => (
            <label key={s.key} className="inline-flex items-center gap-2">
              <input
                type="radio"
                name="backtest-source"
                className="size-4 accent-ink"
                checked={source === s.key}
                onChange={() => setSource(s.key)}
              />
              {s.label}
            </label>
          ))}
        </div>
      </fieldset>
      {source === 'range' ? (
        <RangeSource timeZone={loop.timeZone} samplePeriodS={loop.samplePeriodS} busy={start.isPending} onStart={run} />
      ) : (
        <UploadSource loop={loop} busy={start.isPending} onStart={run} />
      )}
      {start.isPending && source === 'upload' ? (
        <p role="status" className="text-sm">
          Uploading and checking the file…
        </p>
      ) : null}
      {start.error ? <ErrorNotice error={start.error} /> : null}
    </section>
  );
}
