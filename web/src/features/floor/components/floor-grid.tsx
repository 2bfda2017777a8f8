import { plural } from '../../../lib/format-number';
import type { AreaGroup } from '../utils/tile-order';
import { FloorTile } from './floor-tile';

/** The tiles, one group per area in the plant's order; small areas share a row. */
export function FloorGrid({ groups, now }: { groups: AreaGroup[]; now: number }) {
  return (
    <div className="flex flex-wrap items-start gap-x-8 gap-y-5">
      {groups.map((group) => (
        <section key={group.areaId} aria-labelledby={`area-${group.areaId}`} className="min-w-0 space-y-2">
          <h2 id={`area-${group.areaId}`} className="border-b border-rule pb-0.5 text-base font-bold">
            {group.areaName} <span className="font-normal text-ink/70">· {plural(group.loops.length, 'loop')}</span>
          </h2>
          <ul className="flex flex-wrap gap-3">
            {group.loops.map((loop) => (
              <li key={loop.id} className="w-64">
                <FloorTile loop={loop} now={now} />
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
