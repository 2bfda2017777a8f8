import type { Area } from '@shadowloop/api/contracts';
import type { Loop, TrackingStatus } from '../../loops/api/get-loops';

/** A loop as the Floor shows it: the list's fields (tracking included) and the residual band when known. */
export type FloorLoop = Loop & { band?: (number | null)[] };

export type StatusFilter = TrackingStatus | 'all';
export type TileOrder = 'worst_residual' | 'tag';

/** Most in need of a look first, for ties and for loops without a known residual. */
const SEVERITY: Record<TrackingStatus, number> = { diverged: 0, drifting: 1, stale: 2, in_step: 3, no_twin: 4 };

export function filterTiles(loops: readonly FloorLoop[], filter: StatusFilter): FloorLoop[] {
  return filter === 'all' ? [...loops] : loops.filter((loop) => loop.status === filter);
}

/** Worst residual (largest share of its band) first; loops without one after, by status, then tag. */
export function compareWorstFirst(a: FloorLoop, b: FloorLoop): number {
  const fa = a.worstBandFraction ?? null;
  const fb = b.worstBandFraction ?? null;
  if (fa !== fb) {
    if (fa === null) return 1;
    if (fb === null) return -1;
    return fb - fa;
  }
  return SEVERITY[a.status] - SEVERITY[b.status] || a.tag.localeCompare(b.tag);
}

export function sortTiles(loops: FloorLoop[], order: TileOrder): FloorLoop[] {
  return loops.sort(order === 'tag' ? (a, b) => a.tag.localeCompare(b.tag) : compareWorstFirst);
}

export type AreaGroup = { areaId: string; areaName: string; loops: FloorLoop[] };

/** Tiles grouped by area, areas in the plant's display order (unknown areas last, by name). */
export function groupByArea(loops: readonly FloorLoop[], areas: readonly Area[]): AreaGroup[] {
  const groups = new Map<string, AreaGroup>();
  for (const loop of loops) {
    const group = groups.get(loop.area) ?? { areaId: loop.area, areaName: loop.areaName, loops: [] };
    group.loops.push(loop);
    groups.set(loop.area, group);
  }
  const rank = (id: string) => {
    const i = areas.findIndex((area) => area.id === id);
    return i < 0 ? areas.length : i;
  };
  return [...groups.values()].sort((a, b) => rank(a.areaId) - rank(b.areaId) || a.areaName.localeCompare(b.areaName));
}

/** "12 loops: 9 in step, 2 drifting, 1 diverged" — the counts behind the filter. */
export function statusCounts(loops: readonly FloorLoop[]): Record<TrackingStatus, number> {
  const counts: Record<TrackingStatus, number> = { in_step: 0, drifting: 0, diverged: 0, stale: 0, no_twin: 0 };
  for (const loop of loops) counts[loop.status] += 1;
  return counts;
}
