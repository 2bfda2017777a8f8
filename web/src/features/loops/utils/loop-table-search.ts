import type { TrackingStatus } from '../api/get-loops';

export const TRACKING_STATUS_ORDER: readonly TrackingStatus[] = ['diverged', 'drifting', 'stale', 'in_step', 'no_twin'];

export type LoopTableSearch = { area: string; status: TrackingStatus | ''; text: string; page: number };

/** The table's filters live in the address, so a filtered list can be bookmarked and shared. */
export function readLoopTableSearch(search: URLSearchParams): LoopTableSearch {
  const status = search.get('status') ?? '';
  const page = Number.parseInt(search.get('page') ?? '1', 10);
  return {
    area: search.get('area') ?? '',
    status: (TRACKING_STATUS_ORDER as readonly string[]).includes(status) ? (status as TrackingStatus) : '',
    text: search.get('q') ?? '',
    page: Number.isFinite(page) && page > 0 ? page : 1,
  };
}

export function writeLoopTableSearch(value: LoopTableSearch): URLSearchParams {
  const next = new URLSearchParams();
  if (value.area) next.set('area', value.area);
  if (value.status) next.set('status', value.status);
  if (value.text) next.set('q', value.text);
  if (value.page > 1) next.set('page', String(value.page));
  return next;
}
