import { useQuery } from '@tanstack/react-query';
import { useId } from 'react';
import { StatusWord } from '../../../components/ui/status-word';
import { healthQueryOptions } from '../api/get-health';
import { describeCheck, summariseHealth } from '../health-summary';

export function HealthDot() {
  const { data, isError } = useQuery(healthQueryOptions());
  const summary = summariseHealth(data, isError);
  const lines = isError
    ? ['The health report did not answer. The server may be down or unreachable.']
    : data
      ? Object.entries(data.checks).map(([name, check]) => describeCheck(name, check))
      : ['Waiting for the first health report.'];
  const detailsId = useId();

  return (
    <div className="group relative">
      <button
        type="button"
        aria-describedby={detailsId}
        aria-label={`System health: ${summary.word}`}
        className="rounded-sm px-2 py-1 text-sm hover:bg-ink/5 focus-visible:outline-2 focus-visible:outline-twin"
      >
        <StatusWord tone={summary.tone} label={summary.word} />
      </button>
      <div
        id={detailsId}
        role="tooltip"
        className="invisible absolute right-0 top-full z-20 mt-1 w-72 rounded-sm border border-rule bg-panel p-3 text-xs shadow-md group-focus-within:visible group-hover:visible"
      >
        <p className="mb-1 font-bold">System health, checked every 15 s</p>
        <ul className="space-y-0.5">
          {lines.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </div>
    </div>
  );
}
