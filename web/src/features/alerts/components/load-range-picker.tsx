import { Button } from '../../../components/ui/button';
import { CustomRangeForm } from '../../twin/components/custom-range-form';
import { LOAD_RANGES, type LoadRange } from '../utils/load-range';

type LoadRangePickerProps = {
  range: LoadRange;
  window: { from: string; to: string };
  timeZone: string;
  onChange: (range: LoadRange) => void;
};

export function LoadRangePicker({ range, window, timeZone, onChange }: LoadRangePickerProps) {
  const fixed = range.kind === 'fixed';
  return (
    <div className="space-y-2">
      <div role="group" aria-label="Report range" className="flex flex-wrap items-center gap-2">
        <span className="text-sm font-medium">The last</span>
        {LOAD_RANGES.map((r) => (
          <Button
            key={r.key}
            aria-pressed={range.kind === 'recent' && range.key === r.key}
            variant={range.kind === 'recent' && range.key === r.key ? 'primary' : 'secondary'}
            onClick={() => onChange({ kind: 'recent', key: r.key })}
          >
            {r.label}
          </Button>
        ))}
        <Button
          aria-pressed={fixed}
          variant={fixed ? 'primary' : 'secondary'}
          onClick={() => onChange({ kind: 'fixed', fromMs: Date.parse(window.from), toMs: Date.parse(window.to) })}
        >
          Other dates…
        </Button>
      </div>
      {range.kind === 'fixed' ? (
        <CustomRangeForm
          key={`${range.fromMs}|${range.toMs}`}
          range={range}
          timeZone={timeZone}
          onApply={(next) => next.kind === 'fixed' && onChange(next)}
        />
      ) : null}
    </div>
  );
}
