import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { twinSocket } from '../../../lib/socket';
import type { Loop, TrackingStatus } from '../../loops/api/get-loops';
import { trackingKey, trackingQueryOptions, type LoopTracking } from '../api/get-tracking';

/** Stale is derived when asked (no reading arrives to announce it), so the tracking is asked for again. */
const REFRESH_MS = 30_000;

/**
 * A loop's tracking status as it is now: from its tracking, kept current by the status each twin
 * sample carries (the cache changes only when the status does).
 */
export function useTrackingStatus(loop: Loop | undefined): TrackingStatus | undefined {
  const queryClient = useQueryClient();
  const loopId = loop?.id ?? '';
  const hasTwin = Boolean(loop?.activeVersionId);
  const tracking = useQuery({
    ...trackingQueryOptions(loopId),
    enabled: hasTwin,
    refetchInterval: REFRESH_MS,
    retry: false,
  });

  useEffect(() => {
    if (!hasTwin) return;
    return twinSocket().watchLoop(loopId, (sample) =>
      queryClient.setQueryData<LoopTracking>(trackingKey(loopId), (current) =>
        current && current.status !== sample.status ? { ...current, status: sample.status } : current,
      ),
    );
  }, [hasTwin, loopId, queryClient]);

  return hasTwin ? (tracking.data?.status ?? loop?.status) : loop?.status;
}
