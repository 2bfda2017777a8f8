import { useQuery } from '@tanstack/react-query';
import type { DriftRuleKind } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { formatPlantTime } from '../../../lib/plant-time';
import { driftRuleVersionsQueryOptions } from '../api/get-drift-rules';
import { describeParams } from '../utils/describe-params';

type RuleVersionsProps = {
  loopId: string;
  kind: DriftRuleKind;
  outputs: { name: string; unit: string }[];
  timeZone: string;
};

function VersionList({ loopId, kind, outputs, timeZone }: RuleVersionsProps) {
  const versions = useQuery(driftRuleVersionsQueryOptions(loopId, kind));
  if (versions.isError) return <ErrorNotice error={versions.error} onRetry={() => void versions.refetch()} />;
  if (!versions.data) return <p role="status">Loading the versions…</p>;
  if (versions.data.length === 0) return <p>This rule has not been saved yet.</p>;
  return (
    <ol className="space-y-2">
      {versions.data.map((v) => (
        <li key={v.version} className="border-l-2 border-rule pl-3">
          <p className="font-medium tabular-nums">
            Version {v.version} · {formatPlantTime(Date.parse(v.changedAt), timeZone, { date: true, seconds: false })} ·{' '}
            {v.changedBy ?? 'Shadowloop'} · {v.enabled ? 'on' : 'off'}, P{v.priority}
          </p>
          <p className="text-ink/80">{describeParams(kind, v.params, outputs)}</p>
          {v.note ? <p className="italic">“{v.note}”</p> : null}
        </li>
      ))}
    </ol>
  );
}

/** Earlier versions of the rule, loaded when the disclosure is opened. */
export function RuleVersions(props: RuleVersionsProps) {
  const [open, setOpen] = useState(false);
  return (
    <details className="text-sm" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="cursor-pointer font-medium">Version history</summary>
      <div className="mt-2">{open ? <VersionList {...props} /> : null}</div>
    </details>
  );
}
