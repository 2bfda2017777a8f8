import { useId } from 'react';
import { Link } from 'react-router';
import { VersionStatusWord } from '../../models/components/version-status-word';
import type { Version } from '../../models/types';
import { LIMITS } from '../types';
import { toggleVersion } from '../utils/version-defaults';

type VersionCheckboxesProps = {
  loopId: string;
  versions: Version[];
  picked: string[];
  onChange: (picked: string[]) => void;
  error?: string;
};

/** The loop's versions, newest first; at most LIMITS.maxVersions at once. */
export function VersionCheckboxes({ loopId, versions, picked, onChange, error }: VersionCheckboxesProps) {
  const hintId = useId();
  if (versions.length === 0) {
    return (
      <p className="text-sm">
        This loop has no model versions yet.{' '}
        <Link to={`/models/${loopId}/new`} className="underline">
          Add one
        </Link>{' '}
        before backtesting.
      </p>
    );
  }
  const full = picked.length >= LIMITS.maxVersions;
  return (
    <fieldset className="space-y-1 text-sm" aria-describedby={hintId}>
      <legend className="font-medium">Model versions to replay</legend>
      <p id={hintId} className="text-xs text-ink/70">
        Tick the active version and a candidate to get a side-by-side verdict; at most {LIMITS.maxVersions} at once.
      </p>
      <ul className="flex flex-wrap gap-x-5 gap-y-1">
        {[...versions]
          .sort((a, b) => b.number - a.number)
          .map((version) => {
            const on = picked.includes(version.id);
            return (
              <li key={version.id}>
                <label className="inline-flex items-center gap-2">
                  <input
                    type="checkbox"
                    className="size-4 accent-ink"
                    checked={on}
                    disabled={!on && full}
                    onChange={(e) => onChange(toggleVersion(picked, version.id, e.target.checked))}
                  />
                  <span className="font-medium">Version {version.number}</span>
                  <VersionStatusWord status={version.status} />
                </label>
              </li>
            );
          })}
      </ul>
      {error ? <p className="text-xs font-medium text-diverged">{error}</p> : null}
    </fieldset>
  );
}
