import { useQuery } from '@tanstack/react-query';
import type { Area } from '../../loops/api/get-areas';
import { onCallNowQueryOptions, type OnCallNow } from '../api/get-oncall-now';

type Pair = Pick<OnCallNow, 'primary' | 'secondary'>;

const pairText = (pair: Pair) =>
  `primary ${pair.primary?.name ?? 'nobody'}, secondary ${pair.secondary?.name ?? 'nobody'}`;

/** Who is called now: plant-wide, and where an area's own shift takes over. */
export function OnCallNowSummary({ areas }: { areas: Area[] }) {
  const now = useQuery(onCallNowQueryOptions());
  if (!now.data) return null;
  const nameOf = (areaId: string) => areas.find((a) => a.id === areaId)?.name ?? areaId;
  const own = now.data.areas.filter(
    (a) => a.primary?.id !== now.data.primary?.id || a.secondary?.id !== now.data.secondary?.id,
  );
  return (
    <section aria-label="On call now" className="rounded-sm border border-rule bg-panel px-4 py-2 text-sm">
      <p>
        <span className="font-bold">On call now, plant-wide:</span> {pairText(now.data)}.
      </p>
      {own.map((area) => (
        <p key={area.area}>
          <span className="font-medium">{nameOf(area.area)}:</span> {pairText(area)}.
        </p>
      ))}
    </section>
  );
}
