import { INPUT_CLASSES } from '../../../../components/ui/field';
import { signalLabel } from '../../utils/signal-labels';

type InputSelectProps = { inputs: { name: string; unit: string }[]; value: number; onChange: (input: number) => void };

/** Which input steps; only shown when the loop has more than one. */
export function InputSelect({ inputs, value, onChange }: InputSelectProps) {
  if (inputs.length < 2) return null;
  return (
    <label className="flex flex-col gap-1 text-sm">
      <span className="font-medium">Unit step in</span>
      <select value={value} onChange={(e) => onChange(Number(e.target.value))} className={INPUT_CLASSES}>
        {inputs.map((signal, j) => (
          <option key={j} value={j}>
            {signalLabel(signal)}
          </option>
        ))}
      </select>
    </label>
  );
}
