import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { twinSocket, type LoopStatusChange } from '../../../lib/socket';
import { loopKeys } from '../../loops/api/get-loops';
import { trackingKey, type LoopTracking } from '../../twin/api/get-tracking';
import type { FloorLoop } from '../utils/tile-order';

function applyStatus(loops: FloorLoop[] | undefined, change: LoopStatusChange): FloorLoop[] | undefined {
  return loops?.map((loop) =>
    loop.id === change.loopId
      ? {
          ...loop,
          status: change.status,
          lastReadingAt: change.lastReadingAt,
          worstBandFraction: change.worstBandFraction,
        }
      : loop,
  );
}

function applyToTracking(tracking: LoopTracking | undefined, change: LoopStatusChange): LoopTracking | undefined {
  return (
    tracking && {
      ...tracking,
      status: change.status,
      lastReadingAt: change.lastReadingAt,
      worstBandFraction: change.worstBandFraction,
    }
  );
}

/**
 * Watches the rooms of the areas on the Floor: a loop's status change (pushed when it happens)
 * goes straight into the cached loop list and the loop's tracking, which order and colour the tiles.
 */
export function useFloorStatusUpdates(areaIds: readonly string[]): void {
  const queryClient = useQueryClient();
  const key = [...new Set(areaIds)].sort().join('\n');
  useEffect(() => {
    if (!key) return;
    const socket = twinSocket();
    const stops = key.split('\n').map((areaId) =>
      socket.watchArea(areaId, (change) => {
        queryClient.setQueryData<FloorLoop[]>(loopKeys.list(), (loops) => applyStatus(loops, change));
        queryClient.setQueryData<LoopTracking>(trackingKey(change.loopId), (tracking) =>
          applyToTracking(tracking, change),
        );
      }),
    );
    return () => stops.forEach((stop) => stop());
  }, [key, queryClient]);
}
