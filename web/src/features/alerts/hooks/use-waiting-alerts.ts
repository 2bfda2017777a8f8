import { useQuery } from '@tanstack/react-query';
import { alertsQueryOptions } from '../api/get-alerts';
import { WAITING_STATES, type AlertFilters } from '../utils/alert-filters';

/** The queue's filter for alerts nobody has acknowledged yet, in the frame's link and the queue alike. */
export const WAITING_FILTERS: AlertFilters = { states: WAITING_STATES, order: 'urgent' };
export const WAITING_QUEUE_PATH = `/alerts?state=${WAITING_STATES.join(',')}`;

/** Alerts waiting for acknowledgement, newest first; kept current by the pushed alert events. */
export function useWaitingAlerts(enabled: boolean) {
  return useQuery({ ...alertsQueryOptions(WAITING_FILTERS), enabled });
}
