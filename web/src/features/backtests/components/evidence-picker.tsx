import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { loopQueryOptions } from '../../loops/api/get-loop';
import { loopBacktestsQueryOptions } from '../api/get-loop-backtests';
import { sourceText, versionNumbersText } from '../utils/backtest-words';

type EvidencePickerProps = {
  version: { id: string; number: number; loopId: string };
  picked: string[];
  onChange: (picked: string[]) => void;
};

/** Finished backtests that include this version, to attach when it goes to review; those attached already stay ticked. */
export function EvidencePicker({ version, picked, onChange }: EvidencePickerProps) {
  const backtests = useQuery(loopBacktestsQueryOptions(version.loopId));
  const loop = useQuery(loopQueryOptions(version.loopId));
  const timeZone = loop.data?.timeZone ?? 'UTC';
  if (backtests.isError) {
    return <p className="text-sm">The loop&apos;s backtests could not be loaded, so none can be attached here now.</p>;
  }
  if (!backtests.data) return null;
  const usable = backtests.data.filter((b) => b.status === 'succeeded' && b.versions.some((v) => v.id === version.id));
  if (usable.length === 0) {
    return (
      <p className="text-sm">
        No finished backtest includes version {version.number} yet.{' '}
        <Link to={`/loops/${version.loopId}/backtests`} className="underline">
          Run one
        </Link>{' '}
        to give the reviewer evidence against the active version.
      </p>
    );
  }
  return (
    <fieldset className="space-y-1 text-sm">
      <legend className="font-medium">Backtests to attach as evidence</legend>
      {usable.map((b) => {
        const attached = b.attachedTo.some((a) => a.versionId === version.id);
        const label = `${versionNumbersText(b.versions.map((v) => v.number))} over ${sourceText(b, timeZone)}`;
        return (
          <label key={b.id} className="flex items-start gap-2">
            <input
              type="checkbox"
              className="mt-0.5 size-4 accent-ink"
              checked={attached || picked.includes(b.id)}
              disabled={attached}
              onChange={(e) => onChange(e.target.checked ? [...picked, b.id] : picked.filter((id) => id !== b.id))}
            />
            <span>
              <span className="font-medium">{label}</span>
              {attached ? ' (attached)' : ''}
              {b.verdict ? <span className="block text-xs text-ink/75">{b.verdict}</span> : null}
            </span>
          </label>
        );
      })}
    </fieldset>
  );
}
