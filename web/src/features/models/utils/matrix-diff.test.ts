import { describe, expect, it } from 'vitest';
import { describeCellChange, diffMatrix, summarizeDiff } from './matrix-diff';

describe('diffMatrix', () => {
  it('marks exactly the cells that changed and says by how much', () => {
    const diff = diffMatrix(
      [
        [0.95, 0.1],
        [0, 0.8],
      ],
      [
        [0.97, 0.1],
        [0, 0.75],
      ],
    );
    expect(diff.kind).toBe('compared');
    if (diff.kind !== 'compared') return;
    expect(diff.changedCount).toBe(2);
    expect(diff.cells.map((row) => row.map((cell) => cell.changed))).toEqual([
      [true, false],
      [false, true],
    ]);
    expect(describeCellChange(diff.cells[0][0])).toBe('0.95 → 0.97 (+0.02)');
    expect(describeCellChange(diff.cells[1][1])).toBe('0.8 → 0.75 (−0.05)');
    expect(describeCellChange(diff.cells[0][1])).toBe('0.1');
    expect(summarizeDiff('A', diff)).toBe('A: 2 of 4 cells changed.');
  });

  it('treats round-off far below the numbers as unchanged', () => {
    const diff = diffMatrix([[0.1 + 0.2]], [[0.3]]);
    expect(diff.kind === 'compared' && diff.changedCount).toBe(0);
    expect(summarizeDiff('B', diff)).toBe('B: unchanged.');
  });

  it('does not compare cell by cell when the size changed', () => {
    const diff = diffMatrix(
      [[1]],
      [
        [1, 0],
        [0, 1],
      ],
    );
    expect(diff).toEqual({ kind: 'reshaped', before: '1×1', after: '2×2' });
    expect(summarizeDiff('A', diff)).toContain('size changed from 1×1 to 2×2');
  });

  it('tells a matrix given in only one version', () => {
    expect(diffMatrix(null, [[1, 0, 0]])).toEqual({ kind: 'added', rows: 1, columns: 3 });
    expect(diffMatrix([[1]], null)).toEqual({ kind: 'removed', rows: 1, columns: 1 });
    expect(diffMatrix(null, null)).toEqual({ kind: 'absent' });
    expect(summarizeDiff('D', diffMatrix(null, [[0]]))).toBe('D: only in this version (1×1).');
  });
});
