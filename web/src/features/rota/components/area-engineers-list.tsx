import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import type { Area } from '../../loops/api/get-areas';
import { areaEngineersQueryOptions } from '../api/get-area-engineers';

/** The third step of escalation: each area's engineers. */
export function AreaEngineersList({ areas }: { areas: Area[] }) {
  const engineers = useQuery(areaEngineersQueryOptions());
  if (engineers.isError) return <ErrorNotice error={engineers.error} onRetry={() => void engineers.refetch()} />;
  if (!engineers.data) return <p role="status" className="h-16 animate-pulse rounded-sm bg-rule/40" />;
  const nameOf = (areaId: string) => areas.find((a) => a.id === areaId)?.name ?? areaId;
  const listed = engineers.data.filter((row) => row.engineers.length > 0);
  if (listed.length === 0) {
    return (
      <p className="text-sm text-ink/75">
        No area has engineers named yet, so escalation stops at the secondary on call. An administrator names them.
      </p>
    );
  }
  return (
    <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[10rem_1fr]">
      {listed.map((row) => (
        <div key={row.area} className="contents">
          <dt className="font-medium">{nameOf(row.area)}</dt>
          <dd>{row.engineers.map((person) => person.name).join(', ')}</dd>
        </div>
      ))}
    </dl>
  );
}
