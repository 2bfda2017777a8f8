import { useQuery } from '@tanstack/react-query';
import { loopsQueryOptions } from '../../loops/api/get-loops';

type LoopPickerProps = { selected: readonly string[]; onChange: (loopIds: string[]) => void; legend: string };

/** Checkboxes of every loop, grouped by area: the loops a source may post readings for. */
export function LoopPicker({ selected, onChange, legend }: LoopPickerProps) {
  const loops = useQuery(loopsQueryOptions());
  const byArea = new Map<string, { name: string; loops: { id: string; tag: string; name: string }[] }>();
  for (const loop of loops.data ?? []) {
    const group = byArea.get(loop.area) ?? { name: loop.areaName, loops: [] };
    group.loops.push(loop);
    byArea.set(loop.area, group);
  }
  const toggle = (id: string, on: boolean) => onChange(on ? [...selected, id] : selected.filter((s) => s !== id));

  return (
    <fieldset className="space-y-2 text-sm">
      <legend className="font-medium">{legend}</legend>
      {loops.isPending ? <p className="text-ink/70">Loading the loops…</p> : null}
      {loops.data?.length === 0 ? (
        <p className="text-ink/70">No loops are registered yet; a source can be scoped to loops later.</p>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        {[...byArea.entries()].map(([areaId, group]) => (
          <div key={areaId}>
            <p className="text-xs font-bold uppercase tracking-wide text-ink/70">{group.name}</p>
            {group.loops.map((loop) => (
              <label key={loop.id} className="flex items-center gap-2 py-0.5">
                <input
                  type="checkbox"
                  checked={selected.includes(loop.id)}
                  onChange={(e) => toggle(loop.id, e.target.checked)}
                />
                <span>
                  <span className="font-medium">{loop.tag}</span> · {loop.name}
                </span>
              </label>
            ))}
          </div>
        ))}
      </div>
    </fieldset>
  );
}
