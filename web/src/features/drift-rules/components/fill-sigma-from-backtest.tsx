import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { Link } from 'react-router';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { formatInTimeZone } from '../../../lib/format-time';
import { backtestQueryOptions } from '../../backtests/api/get-backtest';
import { loopBacktestsQueryOptions } from '../../backtests/api/get-loop-backtests';
import type { Backtest, BacktestSummary } from '../../backtests/types';
import { count, sourceText } from '../../backtests/utils/backtest-words';
import { loopQueryOptions } from '../../loops/api/get-loop';
import type { Loop } from '../../loops/api/get-loops';
import { SigmaFillNote, useSigmaFill, type SigmaFill } from './sigma-fill';

type LoopFacts = Pick<Loop, 'activeVersionId' | 'activeVersionNumber' | 'outputs' | 'samplePeriodS' | 'timeZone'>;

/** The loop's succeeded backtests that replayed its active version, in the list's order (newest first). */
export function backtestsOfActiveVersion(backtests: BacktestSummary[], activeVersionId: string): BacktestSummary[] {
  return backtests.filter((b) => b.status === 'succeeded' && b.versions.some((v) => v.id === activeVersionId));
}

/**
 * `backtest of 2025-06-02 09:00 BST, 8,640 samples`: when it was started, on the plant's clock, and
 * its length. A range [from, to) counts (to − from) / T samples at the sample period T; an upload
 * is named by its file.
 */
export function backtestLabel(backtest: BacktestSummary, loop: Pick<LoopFacts, 'samplePeriodS' | 'timeZone'>): string {
  const started = `backtest of ${formatInTimeZone(backtest.createdAt, loop.timeZone)}`;
  if (backtest.source === 'range' && backtest.from && backtest.to) {
    const samples = Math.round((Date.parse(backtest.to) - Date.parse(backtest.from)) / (loop.samplePeriodS * 1000));
    return `${started}, ${count(samples)} samples`;
  }
  return `${started}, ${sourceText(backtest, loop.timeZone)}`;
}

/**
 * The active version's one-step residual standard deviations in a backtest (its rule suggestion's
 * sigma), with where they came from; none, with the reason, when the backtest could not set them.
 */
export function sigmaFromBacktest(backtest: Backtest, loop: LoopFacts): SigmaFill {
  const of = `the backtest of ${formatInTimeZone(backtest.createdAt, loop.timeZone)} over ${sourceText(backtest, loop.timeZone)}`;
  const version = backtest.results?.versions.find((v) => v.versionId === loop.activeVersionId);
  if (!version) return { sigma: null, sentence: `No sigma filled: ${of} has no figures of the active version.` };
  const { sigma, sentence } = version.suggestion;
  if (!sigma) return { sigma: null, sentence: `No sigma filled from ${of}: ${sentence}` };
  if (sigma.length !== loop.outputs.length) {
    return {
      sigma: null,
      sentence: `No sigma filled: ${of} has ${sigma.length} values of sigma for the loop's ${loop.outputs.length} outputs.`,
    };
  }
  return { sigma, sentence: `Sigma from ${of} (one-step residuals of version ${version.versionNumber}).` };
}

/**
 * Pick one of the loop's finished backtests of its active version to fill the sigma fields from;
 * a backtest's results load only once it is picked. Without such a backtest, a pointer to the
 * Backtests tab; without an active version, nothing.
 */
export function FillSigmaFromBacktest({ loopId, onFill }: { loopId: string; onFill: (sigma: string[]) => void }) {
  const selectId = useId();
  const queryClient = useQueryClient();
  const loop = useQuery(loopQueryOptions(loopId));
  const backtests = useQuery(loopBacktestsQueryOptions(loopId));
  const [picked, setPicked] = useState('');
  const { fill, mutation } = useSigmaFill(
    async ({ backtestId, facts }: { backtestId: string; facts: LoopFacts }) =>
      sigmaFromBacktest(await queryClient.fetchQuery(backtestQueryOptions(backtestId)), facts),
    onFill,
  );

  if (!loop.data || loop.data.activeVersionId === null) return null;
  if (backtests.isError) return <p className="text-xs text-ink/75">The loop&apos;s backtests could not be loaded.</p>;
  if (!backtests.data) return null;
  const facts = loop.data;
  const usable = backtestsOfActiveVersion(backtests.data, loop.data.activeVersionId);
  if (usable.length === 0) {
    return (
      <p className="max-w-sm text-xs text-ink/75">
        No finished backtest includes active version {facts.activeVersionNumber} yet: run one on the{' '}
        <Link to={`/loops/${loopId}/backtests`} className="underline">
          Backtests tab
        </Link>{' '}
        to fill sigma from its one-step residuals.
      </p>
    );
  }
  return (
    <div className="space-y-1">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <label htmlFor={selectId} className="font-medium">
          Fill sigma from a backtest
        </label>
        <select
          id={selectId}
          value={picked}
          disabled={mutation.isPending}
          onChange={(e) => {
            setPicked(e.target.value);
            if (e.target.value) fill({ backtestId: e.target.value, facts });
          }}
          className={INPUT_CLASSES}
        >
          <option value="">pick one…</option>
          {usable.map((b) => (
            <option key={b.id} value={b.id}>
              {backtestLabel(b, facts)}
            </option>
          ))}
        </select>
      </div>
      <SigmaFillNote mutation={mutation} />
    </div>
  );
}
