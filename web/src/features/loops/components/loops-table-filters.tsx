import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import type { Area } from '../api/get-areas';
import { TRACKING_STATUS_ORDER, type LoopTableSearch } from '../utils/loop-table-search';
import { TRACKING_STATUS_WORDS } from './tracking-status-word';

type LoopsTableFiltersProps = {
  areas: Area[];
  search: LoopTableSearch;
  onChange: (next: LoopTableSearch) => void;
};

export function LoopsTableFilters({ areas, search, onChange }: LoopsTableFiltersProps) {
  const update = (patch: Partial<LoopTableSearch>) => onChange({ ...search, ...patch, page: 1 });
  const any = search.area !== '' || search.status !== '' || search.text !== '';
  return (
    <form
      role="search"
      aria-label="Filter the loops"
      onSubmit={(e) => e.preventDefault()}
      className="flex flex-wrap items-end gap-3"
    >
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">Find by tag or name</span>
        <input
          type="search"
          value={search.text}
          onChange={(e) => update({ text: e.target.value })}
          className={`w-56 ${INPUT_CLASSES}`}
        />
      </label>
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">Area</span>
        <select value={search.area} onChange={(e) => update({ area: e.target.value })} className={INPUT_CLASSES}>
          <option value="">All areas</option>
          {areas.map((area) => (
            <option key={area.id} value={area.id}>
              {area.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">Tracking status</span>
        <select
          value={search.status}
          onChange={(e) => update({ status: e.target.value as LoopTableSearch['status'] })}
          className={INPUT_CLASSES}
        >
          <option value="">Any status</option>
          {TRACKING_STATUS_ORDER.map((status) => (
            <option key={status} value={status}>
              {TRACKING_STATUS_WORDS[status]}
            </option>
          ))}
        </select>
      </label>
      {any ? (
        <Button variant="quiet" onClick={() => onChange({ area: '', status: '', text: '', page: 1 })}>
          Clear filters
        </Button>
      ) : null}
    </form>
  );
}
