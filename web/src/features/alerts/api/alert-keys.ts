import type { AlertFilters } from '../utils/alert-filters';

/** One hierarchy for every alert query, so a pushed change or an action can refresh them together. */
export const alertKeys = {
  all: ['alerts'] as const,
  lists: () => [...alertKeys.all, 'list'] as const,
  list: (filters: AlertFilters) => [...alertKeys.lists(), filters] as const,
  detail: (alertId: string) => [...alertKeys.all, 'detail', alertId] as const,
  snapshot: (alertId: string, fromMs: number, toMs: number) =>
    [...alertKeys.detail(alertId), 'snapshot', fromMs, toMs] as const,
  load: (from: string, to: string) => [...alertKeys.all, 'load', from, to] as const,
};

export const alertSettingsKey = ['alert-settings'] as const;
