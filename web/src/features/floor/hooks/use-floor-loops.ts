import { useQueries, useQuery } from '@tanstack/react-query';
import { loopsQueryOptions } from '../../loops/api/get-loops';
import { trackingQueryOptions, type LoopTracking } from '../../twin/api/get-tracking';
import type { FloorLoop } from '../utils/tile-order';
import { useFloorStatusUpdates } from './use-floor-status';

/**
 * Status changes are pushed, but a loop going stale is not (no reading arrives to say so): each
 * loop's tracking is asked for again this often.
 */
const TRACKING_REFRESH_MS = 30_000;

function withTracking(loop: FloorLoop, tracking: LoopTracking | undefined): FloorLoop {
  if (!tracking) return loop;
  const { status, lastReadingAt, worstBandFraction, band } = tracking;
  return { ...loop, status, lastReadingAt, worstBandFraction, band };
}

/**
 * The loops of the Floor with their tracking: the loop list, each twin's tracking (status with
 * stale derived, newest reading, band use, the band itself) and the status changes pushed to the
 * areas' rooms. Loops without an active version have no twin, so no tracking is asked for.
 */
export function useFloorLoops() {
  const loops = useQuery(loopsQueryOptions());
  const list: FloorLoop[] = loops.data ?? [];
  const twins = list.filter((loop) => loop.activeVersionId !== null);
  const trackings = useQueries({
    queries: twins.map((loop) => ({
      ...trackingQueryOptions(loop.id),
      refetchInterval: TRACKING_REFRESH_MS,
      retry: false,
    })),
  });
  useFloorStatusUpdates(list.map((loop) => loop.area));
  const byLoop = new Map(twins.map((loop, i) => [loop.id, trackings[i]?.data]));
  return {
    loops: loops.data ? list.map((loop) => withTracking(loop, byLoop.get(loop.id))) : undefined,
    error: loops.error,
    refetch: () => void loops.refetch(),
  };
}
