import { useMemo } from 'react';
import { formatDuration } from '../../../lib/format-number';
import type { Backtest, BacktestResults as Results, VersionBacktest } from '../types';
import { count } from '../utils/backtest-words';
import { AttachEvidence } from './attach-evidence';
import { ComparisonVerdict } from './comparison-verdict';
import { PredictionCharts } from './prediction-charts';
import { VersionResultCard } from './version-result-card';

/** The candidate first, then the active version, then the rest by number. */
function inReadingOrder(results: Results): VersionBacktest[] {
  const rank = (v: VersionBacktest) =>
    v.versionId === results.comparison?.candidateVersionId
      ? 0
      : v.versionId === results.comparison?.activeVersionId
        ? 1
        : 2;
  return [...results.versions].sort((a, b) => rank(a) - rank(b) || b.versionNumber - a.versionNumber);
}

/** mayAttachAs: the signed-in engineer's id (attaching is for the version's author), or null for read-only users. */
type BacktestResultsProps = { backtest: Backtest; results: Results; timeZone: string; mayAttachAs: string | null };

export function BacktestResultsView({ backtest, results, timeZone, mayAttachAs }: BacktestResultsProps) {
  const versions = useMemo(() => inReadingOrder(results), [results]);
  const chartVersions = useMemo(() => versions.map((v) => ({ id: v.versionId, number: v.versionNumber })), [versions]);
  const statusNow = (versionId: string) => backtest.versions.find((v) => v.id === versionId)?.status ?? '';
  const authorOf = (versionId: string) => backtest.versions.find((v) => v.id === versionId)?.authorId ?? null;
  const { slots, measured, missing } = results.samples;
  return (
    <div className="space-y-5">
      <ComparisonVerdict comparison={results.comparison} versions={versions} />
      <p className="text-sm tabular-nums">
        {count(slots)} samples from the first reading to the last, {count(measured)} with a reading
        {missing
          ? ` (${count(missing)} missing: the versions coast through them, as the twin does, and they are not scored)`
          : ''}
        . Computed in {formatDuration(results.elapsedS)}.
      </p>
      <PredictionCharts
        chart={results.chart}
        outputs={versions[0]?.oneStep.outputs ?? []}
        versions={chartVersions}
        timeZone={timeZone}
      />
      <h2 className="border-b border-rule pb-1 text-lg font-bold">Each version</h2>
      {versions.map((result) => {
        const now = statusNow(result.versionId);
        const attachable =
          mayAttachAs !== null &&
          authorOf(result.versionId) === mayAttachAs &&
          (now === 'draft' || now === 'in_review');
        return (
          <VersionResultCard key={result.versionId} result={result} statusNow={now} timeZone={timeZone}>
            {attachable ? (
              <AttachEvidence
                backtestId={backtest.id}
                version={{ id: result.versionId, number: result.versionNumber }}
                attached={backtest.attachedTo.some((a) => a.versionId === result.versionId)}
              />
            ) : null}
          </VersionResultCard>
        );
      })}
    </div>
  );
}
