import { TRACKING_STATUS_ORDER } from '../../loops/utils/loop-table-search';
import type { StatusFilter, TileOrder } from './tile-order';

/** The Floor's filter and order live in the address, so Back from a loop returns to the same view. */
export function readFloorSearch(params: URLSearchParams): { filter: StatusFilter; order: TileOrder } {
  const status = params.get('status') ?? '';
  const filter = (TRACKING_STATUS_ORDER as readonly string[]).includes(status) ? (status as StatusFilter) : 'all';
  return { filter, order: params.get('order') === 'tag' ? 'tag' : 'worst_residual' };
}

export function writeFloorSearch(next: { filter: StatusFilter; order: TileOrder }): URLSearchParams {
  const params = new URLSearchParams();
  if (next.filter !== 'all') params.set('status', next.filter);
  if (next.order !== 'worst_residual') params.set('order', next.order);
  return params;
}
