import { INPUT_CLASSES } from '../../../../components/ui/field';
import { formatDuration } from '../../../../lib/format-number';
import { STEP_HORIZONS } from '../../utils/horizon-defaults';

type HorizonSelectProps = { value: number; samplePeriodS: number; onChange: (samples: number) => void };

export function HorizonSelect({ value, samplePeriodS, onChange }: HorizonSelectProps) {
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium">Horizon</span>
      <select value={value} onChange={(e) => onChange(Number(e.target.value))} className={INPUT_CLASSES}>
        {[...new Set([...STEP_HORIZONS, value])]
          .sort((a, b) => a - b)
          .map((samples) => (
            <option key={samples} value={samples}>
              {samples} samples ({formatDuration(samples * samplePeriodS)})
            </option>
          ))}
      </select>
    </label>
  );
}
