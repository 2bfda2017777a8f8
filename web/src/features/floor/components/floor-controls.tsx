import { INPUT_CLASSES } from '../../../components/ui/field';
import { TRACKING_STATUS_WORDS } from '../../loops/components/tracking-status-word';
import { TRACKING_STATUS_ORDER } from '../../loops/utils/loop-table-search';
import type { TrackingStatus } from '../../loops/api/get-loops';
import type { StatusFilter, TileOrder } from '../utils/tile-order';

type FloorControlsProps = {
  filter: StatusFilter;
  order: TileOrder;
  counts: Record<TrackingStatus, number>;
  total: number;
  onChange: (next: { filter: StatusFilter; order: TileOrder }) => void;
};

export function FloorControls({ filter, order, counts, total, onChange }: FloorControlsProps) {
  const summary = TRACKING_STATUS_ORDER.filter((s) => counts[s] > 0).map(
    (s) => `${counts[s]} ${TRACKING_STATUS_WORDS[s]}`,
  );
  return (
    <form
      role="search"
      aria-label="Filter and order the tiles"
      onSubmit={(e) => e.preventDefault()}
      className="flex flex-wrap items-end gap-3"
    >
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">Tracking status</span>
        <select
          value={filter}
          onChange={(e) => onChange({ filter: e.target.value as StatusFilter, order })}
          className={INPUT_CLASSES}
        >
          <option value="all">Every status</option>
          {TRACKING_STATUS_ORDER.map((status) => (
            <option key={status} value={status}>
              {TRACKING_STATUS_WORDS[status]} ({counts[status]})
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">Order</span>
        <select
          value={order}
          onChange={(e) => onChange({ filter, order: e.target.value as TileOrder })}
          className={INPUT_CLASSES}
        >
          <option value="worst_residual">Worst residual first</option>
          <option value="tag">By tag</option>
        </select>
      </label>
      <p className="pb-1.5 text-sm text-ink/80 tabular-nums" aria-live="polite">
        {total} {total === 1 ? 'loop' : 'loops'}
        {summary.length ? `: ${summary.join(', ')}` : ''}
      </p>
    </form>
  );
}
