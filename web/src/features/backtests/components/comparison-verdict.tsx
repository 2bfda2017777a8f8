import { StatusWord, type StatusTone } from '../../../components/ui/status-word';
import { Table, Td, Th } from '../../../components/ui/table';
import type { Comparison, VersionBacktest } from '../types';
import { BACKTEST_CAUTION, pointsText } from '../utils/backtest-words';

const LEANING: Record<Comparison['better'], { word: string; tone: StatusTone; band: string }> = {
  candidate: { word: 'the candidate is better', tone: 'in_step', band: 'border-l-in-step' },
  active: { word: 'the active version is better', tone: 'drifting', band: 'border-l-drifting' },
  mixed: { word: 'mixed evidence', tone: 'twin', band: 'border-l-twin' },
};

function NoComparison({ versions }: { versions: VersionBacktest[] }) {
  return versions.length === 1
    ? 'One version was replayed, so there is no side-by-side verdict: its figures are below.'
    : versions.some((v) => v.wasActive)
      ? 'Only the active version was replayed, so there is no side-by-side verdict.'
      : 'None of these versions was active when the backtest ran, so there is no side-by-side verdict: compare their figures below.';
}

/** The plain verdict first, the fit differences per output under it, and the caution in a line. */
export function ComparisonVerdict({
  comparison,
  versions,
}: {
  comparison: Comparison | null;
  versions: VersionBacktest[];
}) {
  const leaning = comparison ? LEANING[comparison.better] : null;
  return (
    <section
      aria-label="Verdict"
      className={`space-y-2 rounded-sm border border-rule border-l-4 bg-panel px-4 py-3 ${leaning?.band ?? 'border-l-rule'}`}
    >
      {comparison && leaning ? (
        <>
          <p className="flex flex-wrap items-center gap-x-3 text-base">
            <StatusWord tone={leaning.tone} label={leaning.word} />
            <strong>{comparison.verdict}</strong>
          </p>
          <Table caption="Fit difference per output, candidate − active">
            <thead>
              <tr>
                <Th>Output</Th>
                <Th>Fit difference, one step ahead</Th>
                <Th>Fit difference, free run</Th>
              </tr>
            </thead>
            <tbody className="tabular-nums">
              {comparison.outputs.map((o) => (
                <tr key={o.name}>
                  <Td>{o.unit ? `${o.name} (${o.unit})` : o.name}</Td>
                  <Td>{pointsText(o.fitDelta)}</Td>
                  <Td>{pointsText(o.freeRunFitDelta)}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
          <p className="text-sm">
            Alerts its drift rules would have raised: candidate {comparison.alertsCandidate}, active{' '}
            {comparison.alertsActive}. Positive differences: the candidate fits better.
          </p>
        </>
      ) : (
        <p className="text-base">
          <NoComparison versions={versions} />
        </p>
      )}
      <p role="note" className="text-xs text-ink/80">
        {BACKTEST_CAUTION}
      </p>
    </section>
  );
}
