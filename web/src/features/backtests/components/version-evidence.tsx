import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatNumber, plural } from '../../../lib/format-number';
import { formatInTimeZone } from '../../../lib/format-time';
import { evidenceQueryOptions } from '../api/get-evidence';
import type { Evidence } from '../types';
import { fitText, FIT_NOTE, withUnit } from '../utils/backtest-words';
import { evidenceFitRows } from '../utils/evidence-rows';

const recording = (e: Evidence, timeZone: string) =>
  e.source === 'upload'
    ? `uploaded file ${e.fileName ?? ''}`
    : `${formatInTimeZone(e.from, timeZone)} to ${formatInTimeZone(e.to, timeZone)}`;

const alertsText = (replay: Evidence['version']['replay']) =>
  `${plural(replay.total, 'alert')} (${formatNumber(replay.perDay, 3)} a day)`;

function EvidenceItem({
  evidence,
  versionNumber,
  timeZone,
}: {
  evidence: Evidence;
  versionNumber: number;
  timeZone: string;
}) {
  const active = evidence.active;
  const rows = evidenceFitRows(evidence.version, active);
  const vs = (mine: string, theirs: string) => (active ? `${mine} (active: ${theirs})` : mine);
  return (
    <article
      aria-label={`Backtest over ${recording(evidence, timeZone)}`}
      className="space-y-2 rounded-sm border border-rule bg-panel px-4 py-3 text-sm"
    >
      <p className="text-base font-bold">{evidence.verdict}</p>
      <p className="text-ink/80">
        Replayed over {recording(evidence, timeZone)}; attached by {evidence.attachedBy?.name ?? 'someone'}{' '}
        {formatInTimeZone(evidence.attachedAt, timeZone)}.
      </p>
      {evidence.note ? <p className="border-l-4 border-l-twin pl-3">{evidence.note}</p> : null}
      <Table
        caption={`Fit of version ${versionNumber}${active ? ` against active version ${active.versionNumber}` : ''}`}
      >
        <thead>
          <tr>
            <Th>Output</Th>
            <Th>Fit, one step ahead</Th>
            <Th>Fit, free run</Th>
            <Th>RMSE, one step ahead</Th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {rows.map((row) => (
            <tr key={row.name}>
              <Td>{row.name}</Td>
              <Td>{vs(fitText(row.oneStep), fitText(row.activeOneStep))}</Td>
              <Td>{vs(fitText(row.freeRun), fitText(row.activeFreeRun))}</Td>
              <Td>{vs(withUnit(row.rmse, row.unit), withUnit(row.activeRmse, row.unit))}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <p>
        Its drift rules would have raised {alertsText(evidence.version.replay)}
        {active ? `; active version ${active.versionNumber}: ${alertsText(active.replay)}` : ''}; the target is{' '}
        {formatNumber(evidence.version.replay.targetPerDay, 3)} a day.
      </p>
      <p className="flex flex-wrap justify-between gap-2 text-xs text-ink/75">
        <span>{FIT_NOTE}.</span>
        <Link to={`/backtests/${evidence.backtestId}`} className="text-sm text-ink underline">
          Open the full backtest
        </Link>
      </p>
    </article>
  );
}

type VersionEvidenceProps = {
  version: { id: string; number: number; status: string };
  loopId: string;
  timeZone: string;
};

/** The backtests attached to a version, for its reviewer: each verdict and the version's figures against the active one's. */
export function VersionEvidence({ version, loopId, timeZone }: VersionEvidenceProps) {
  const evidence = useQuery(evidenceQueryOptions(version.id));
  if (evidence.isError) return <ErrorNotice error={evidence.error} onRetry={() => void evidence.refetch()} />;
  if (!evidence.data)
    return <p className="h-16 animate-pulse rounded-sm bg-rule/40" role="status" aria-label="Loading the evidence" />;
  if (evidence.data.length === 0) {
    const open = version.status === 'draft' || version.status === 'in_review';
    return (
      <p className="text-sm">
        No backtest attached.
        {open ? (
          <>
            {' '}
            Run one on the{' '}
            <Link to={`/loops/${loopId}/backtests`} className="underline">
              Backtests tab of the loop
            </Link>{' '}
            and attach it from its page, or tick it when submitting.
          </>
        ) : null}
      </p>
    );
  }
  return (
    <div className="space-y-3">
      {evidence.data.map((e) => (
        <EvidenceItem key={e.backtestId} evidence={e} versionNumber={version.number} timeZone={timeZone} />
      ))}
    </div>
  );
}
