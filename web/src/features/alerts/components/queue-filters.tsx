import type { Priority } from '@shadowloop/api/contracts';
import type { ReactNode } from 'react';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import type { Area } from '../../loops/api/get-areas';
import type { Loop } from '../../loops/api/get-loops';
import { CustomRangeForm } from '../../twin/components/custom-range-form';
import { WAITING_STATES } from '../utils/alert-filters';
import { ORDER_WORDS, type QueueOrder } from '../utils/alert-order';
import { ALERT_STATE_WORDS, PRIORITY_WORDS } from '../utils/alert-words';
import { customWindow, type QueueRange, type QueueSearch } from '../utils/queue-search';

const STATE_CHOICES: { value: string; label: string }[] = [
  { value: 'open', label: 'Open (every state but closed)' },
  { value: WAITING_STATES.join(','), label: 'Waiting for acknowledgement' },
  ...Object.entries(ALERT_STATE_WORDS).map(([value, label]) => ({ value, label: `Only ${label}` })),
  { value: 'all', label: 'Every state, closed too' },
];

const RANGE_CHOICES: { value: QueueRange; label: string }[] = [
  { value: 'any', label: 'Any time' },
  { value: '24h', label: 'Raised in the last 24 h' },
  { value: '7d', label: 'Raised in the last 7 days' },
  { value: '30d', label: 'Raised in the last 30 days' },
  { value: 'custom', label: 'Raised between…' },
];

const DEFAULT_SEARCH: QueueSearch = {
  state: 'open',
  area: '',
  loopId: '',
  priorities: [],
  range: 'any',
  from: '',
  to: '',
  order: 'urgent',
};

type QueueFiltersProps = {
  search: QueueSearch;
  areas: Area[];
  loops: Loop[];
  timeZone: string;
  onChange: (next: QueueSearch) => void;
};

type SelectProps = { label: string; value: string; onChange: (value: string) => void; children: ReactNode };

function Select({ label, value, onChange, children }: SelectProps) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium">{label}</span>
      <select value={value} onChange={(e) => onChange(e.target.value)} className={INPUT_CLASSES}>
        {children}
      </select>
    </label>
  );
}

export function QueueFilters({ search, areas, loops, timeZone, onChange }: QueueFiltersProps) {
  const update = (patch: Partial<QueueSearch>) => onChange({ ...search, ...patch });
  const stateChoices = STATE_CHOICES.some((c) => c.value === search.state)
    ? STATE_CHOICES
    : [...STATE_CHOICES, { value: search.state, label: search.state.replaceAll(',', ', ') }];
  const loopChoices = loops.filter((loop) => !search.area || loop.area === search.area);
  const togglePriority = (priority: Priority) =>
    update({
      priorities: search.priorities.includes(priority)
        ? search.priorities.filter((p) => p !== priority)
        : [...search.priorities, priority].sort(),
    });
  const chooseRange = (range: QueueRange) => {
    if (range !== 'custom') return update({ range, from: '', to: '' });
    const now = Date.now();
    update({ range, from: new Date(now - 7 * 86_400_000).toISOString(), to: new Date(now).toISOString() });
  };
  const changed = JSON.stringify(search) !== JSON.stringify(DEFAULT_SEARCH);

  return (
    <div className="space-y-2">
      <form
        role="search"
        aria-label="Filter the alerts"
        onSubmit={(e) => e.preventDefault()}
        className="flex flex-wrap items-end gap-3"
      >
        <Select label="State" value={search.state} onChange={(state) => update({ state })}>
          {stateChoices.map((choice) => (
            <option key={choice.value} value={choice.value}>
              {choice.label}
            </option>
          ))}
        </Select>
        <Select label="Area" value={search.area} onChange={(area) => update({ area, loopId: '' })}>
          <option value="">Every area</option>
          {areas.map((area) => (
            <option key={area.id} value={area.id}>
              {area.name}
            </option>
          ))}
        </Select>
        <Select label="Loop" value={search.loopId} onChange={(loopId) => update({ loopId })}>
          <option value="">Every loop</option>
          {loopChoices.map((loop) => (
            <option key={loop.id} value={loop.id}>
              {loop.tag} · {loop.name}
            </option>
          ))}
        </Select>
        <fieldset className="flex flex-col gap-1 text-sm">
          <legend className="mb-1 font-medium">Priority (none ticked: every one)</legend>
          <div className="flex gap-3 py-1.5">
            {([1, 2, 3] as const).map((priority) => (
              <label key={priority} className="inline-flex items-center gap-1">
                <input
                  type="checkbox"
                  checked={search.priorities.includes(priority)}
                  onChange={() => togglePriority(priority)}
                />
                P{priority} {PRIORITY_WORDS[priority]}
              </label>
            ))}
          </div>
        </fieldset>
        <Select label="Time" value={search.range} onChange={(range) => chooseRange(range as QueueRange)}>
          {RANGE_CHOICES.map((choice) => (
            <option key={choice.value} value={choice.value}>
              {choice.label}
            </option>
          ))}
        </Select>
        <Select label="Order" value={search.order} onChange={(order) => update({ order: order as QueueOrder })}>
          {Object.entries(ORDER_WORDS).map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </Select>
        {changed ? (
          <Button variant="quiet" onClick={() => onChange(DEFAULT_SEARCH)}>
            Back to every open alert
          </Button>
        ) : null}
      </form>
      {search.range === 'custom' ? (
        <CustomRangeForm
          key={`${search.from}|${search.to}`}
          range={{ kind: 'fixed', ...customWindow(search) }}
          timeZone={timeZone}
          onApply={(range) =>
            range.kind === 'fixed' &&
            update({ from: new Date(range.fromMs).toISOString(), to: new Date(range.toMs).toISOString() })
          }
        />
      ) : null}
    </div>
  );
}
