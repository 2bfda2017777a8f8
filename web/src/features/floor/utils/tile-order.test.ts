import { describe, expect, it } from 'vitest';
import { fakeLoop } from '../../../test/registry-fixtures';
import { filterTiles, groupByArea, sortTiles, statusCounts, type FloorLoop } from './tile-order';

const tile = (
  tag: string,
  status: FloorLoop['status'],
  worstBandFraction: number | null,
  area = 'aeration',
): FloorLoop =>
  fakeLoop({
    id: tag,
    tag,
    status,
    area,
    areaName: area === 'aeration' ? 'Aeration' : 'Storage',
    ...{ worstBandFraction },
  });

const LOOPS = [
  tile('A-1', 'in_step', 0.2),
  tile('A-2', 'diverged', 1.6),
  tile('A-3', 'stale', null),
  tile('S-1', 'drifting', 0.9, 'storage'),
  tile('S-2', 'no_twin', null, 'storage'),
  tile('A-4', 'in_step', 0.2),
];
const tags = (loops: FloorLoop[]) => loops.map((l) => l.tag);

describe('ordering and filtering the Floor', () => {
  it('puts the worst residual first; loops without one follow by status, ties by tag', () => {
    expect(tags(sortTiles([...LOOPS], 'worst_residual'))).toEqual(['A-2', 'S-1', 'A-1', 'A-4', 'A-3', 'S-2']);
    expect(tags(sortTiles([...LOOPS], 'tag'))).toEqual(['A-1', 'A-2', 'A-3', 'A-4', 'S-1', 'S-2']);
  });

  it('filters by tracking status and counts every status', () => {
    expect(tags(filterTiles(LOOPS, 'in_step'))).toEqual(['A-1', 'A-4']);
    expect(filterTiles(LOOPS, 'all')).toHaveLength(6);
    expect(statusCounts(LOOPS)).toEqual({ in_step: 2, drifting: 1, diverged: 1, stale: 1, no_twin: 1 });
  });

  it('groups by area in the plant’s order, keeping the order inside each group', () => {
    const areas = [
      { id: 'storage', name: 'Storage' },
      { id: 'aeration', name: 'Aeration' },
    ];
    const groups = groupByArea(sortTiles([...LOOPS], 'worst_residual'), areas);
    expect(groups.map((g) => [g.areaName, tags(g.loops)])).toEqual([
      ['Storage', ['S-1', 'S-2']],
      ['Aeration', ['A-2', 'A-1', 'A-4', 'A-3']],
    ]);
  });
});
