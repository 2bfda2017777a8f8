import { queryOptions } from '@tanstack/react-query';
import { ApiError } from '../../../lib/api';
import { networkError, readJsonSafely, toApiError } from '../../../lib/api-error';

export type HealthCheck = { ok: boolean; detail?: string; lastBeatAt?: string | null };

export type HealthReport = {
  status: 'ok' | 'degraded';
  checks: Record<string, HealthCheck>;
};

export const HEALTH_POLL_MS = 15_000;

function isHealthReport(body: unknown): body is HealthReport {
  return typeof body === 'object' && body !== null && 'status' in body && 'checks' in body;
}

/** The health route answers 503 with the same body when the database is down, so read it anyway. */
export async function getHealth(signal?: AbortSignal): Promise<HealthReport & { httpStatus: number }> {
  let response: Response;
  try {
    response = await fetch('/api/health', { credentials: 'include', signal });
  } catch (cause) {
    throw networkError(cause);
  }
  if (response.ok || response.status === 503) {
    const body = await readJsonSafely(response);
    if (isHealthReport(body)) return { ...body, httpStatus: response.status };
    throw new ApiError(response.status, 'health_unreadable', 'The health report could not be read.');
  }
  throw await toApiError(response);
}

export function healthQueryOptions() {
  return queryOptions({
    queryKey: ['health'] as const,
    queryFn: ({ signal }) => getHealth(signal),
    refetchInterval: HEALTH_POLL_MS,
    staleTime: HEALTH_POLL_MS,
    retry: false,
  });
}
