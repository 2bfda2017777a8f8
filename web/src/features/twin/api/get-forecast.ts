import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api';
import { loopKeys } from '../../loops/api/get-loops';

import type { Forecast } from '@shadowloop/api/contracts';

export type { Forecast };

export const FORECAST_SAMPLES = 60;
/** The forecast starts from the twin's newest state, so it is asked for again every few samples. */
const REFRESH_EVERY_SAMPLES = 5;

export function getForecast(loopId: string, n: number, signal?: AbortSignal): Promise<Forecast> {
  return apiFetch<Forecast>(`/api/v1/loops/${encodeURIComponent(loopId)}/forecast?n=${n}`, { signal });
}

export function forecastQueryOptions(loopId: string, samplePeriodS: number, enabled = true) {
  const refreshMs = Math.max(5_000, REFRESH_EVERY_SAMPLES * samplePeriodS * 1000);
  return queryOptions({
    queryKey: [...loopKeys.detail(loopId), 'forecast', FORECAST_SAMPLES] as const,
    queryFn: ({ signal }) => getForecast(loopId, FORECAST_SAMPLES, signal),
    enabled,
    staleTime: refreshMs,
    refetchInterval: refreshMs,
    retry: false,
  });
}
