import { formatPlantTimestamp } from '../../../lib/plant-time';
import { useQuery } from '@tanstack/react-query';
import { loopsQueryOptions, type Loop } from '../../loops/api/get-loops';

export function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

/** The zone most of the plant's loops keep their clocks in. */
export function mostCommonTimeZone(loops: readonly Pick<Loop, 'timeZone'>[]): string | null {
  const counts = new Map<string, number>();
  for (const loop of loops) counts.set(loop.timeZone, (counts.get(loop.timeZone) ?? 0) + 1);
  let best: string | null = null;
  for (const [zone, count] of counts) if (best === null || count > (counts.get(best) ?? 0)) best = zone;
  return best;
}

/**
 * Pages that span loops (alerts, rota, alert load) show the plant's clock: the time zone of its
 * loops; the browser's own zone until a loop is registered.
 */
export function usePlantTimeZone(): string {
  return usePlantClock().timeZone;
}

/** The plant's zone, and whether the loops that tell it have been asked for yet. */
export function usePlantClock(): { timeZone: string; settled: boolean } {
  const loops = useQuery(loopsQueryOptions());
  return {
    timeZone: mostCommonTimeZone(loops.data ?? []) ?? browserTimeZone(),
    settled: loops.isSuccess || loops.isError,
  };
}

/** Formats ISO instants on the plant's clock with the zone's abbreviation (admin tables, logs). */
export function usePlantTimestamp(): (iso: string | null | undefined) => string {
  const timeZone = usePlantTimeZone();
  return (iso) => formatPlantTimestamp(iso, timeZone);
}
