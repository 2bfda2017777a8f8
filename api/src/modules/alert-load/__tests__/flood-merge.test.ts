import { describe, expect, it } from 'vitest';
import { mergeFloods } from '../flood-merge.js';

const at = (minutes: number) => new Date(Date.UTC(2025, 2, 1, 0, minutes)).toISOString();
const w = (minutes: number, count: number) => ({ start: at(minutes), count });

describe('mergeFloods', () => {
  it('keeps only windows with more activations than the threshold', () => {
    expect(mergeFloods([w(0, 10), w(10, 3), w(30, 11)], 10)).toEqual([{ start: at(30), end: at(40), count: 11 }]);
  });

  it('merges back-to-back flood windows into one flood and sums their activations', () => {
    expect(mergeFloods([w(0, 12), w(10, 15), w(20, 11)], 10)).toEqual([{ start: at(0), end: at(30), count: 38 }]);
  });

  it('starts a new flood after a quiet window, or after a window left out because it had none', () => {
    const windows = [w(0, 12), w(10, 2), w(20, 13), w(40, 14)];
    expect(mergeFloods(windows, 10)).toEqual([
      { start: at(0), end: at(10), count: 12 },
      { start: at(20), end: at(30), count: 13 },
      { start: at(40), end: at(50), count: 14 },
    ]);
  });

  it('accepts windows in any order', () => {
    expect(mergeFloods([w(20, 20), w(0, 20), w(10, 20)], 10)).toEqual([{ start: at(0), end: at(30), count: 60 }]);
  });

  it('finds none in an empty or quiet period', () => {
    expect(mergeFloods([], 10)).toEqual([]);
    expect(mergeFloods([w(0, 1), w(10, 10)], 10)).toEqual([]);
  });
});
