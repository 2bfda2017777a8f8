import { INPUT_CLASSES } from '../../../../components/ui/field';
import type { Version } from '../../types';
import { VERSION_STATUS_WORDS } from '../version-status-word';

type PickerProps = { versions: Version[]; thisId: string; otherId: string | null; onPick: (id: string) => void };

export function OtherVersionPicker({ versions, thisId, otherId, onPick }: PickerProps) {
  const choices = versions.filter((v) => v.id !== thisId);
  if (choices.length === 0) return null;
  return (
    <label className="flex items-center gap-2 text-sm">
      <span className="font-medium">Compare with</span>
      <select value={otherId ?? ''} onChange={(e) => onPick(e.target.value)} className={INPUT_CLASSES}>
        {choices.map((v) => (
          <option key={v.id} value={v.id}>
            version {v.number} ({VERSION_STATUS_WORDS[v.status]})
          </option>
        ))}
      </select>
    </label>
  );
}
