import { describe, expect, it } from 'vitest';
import { RingBuffer } from '../../../lib/ring-buffer';
import { mergePoint } from './merge-point';

/** Two columns: measured and predicted of one output. */
const rows = (buffer: RingBuffer) => buffer.toAlignedData();

describe('merging live samples into a raw trend', () => {
  it('appends new slots and fills in a slot that first came with its prediction only', () => {
    const buffer = new RingBuffer(10, 2);
    mergePoint(buffer, 10, [1, 1.1], null);
    mergePoint(buffer, 20, [NaN, 2.1], null);
    mergePoint(buffer, 20, [2, NaN], null);
    expect(rows(buffer)).toEqual([
      [10, 20],
      [1, 2],
      [1.1, 2.1],
    ]);
  });

  it('slots a late sample in time order', () => {
    const buffer = new RingBuffer(10, 2);
    mergePoint(buffer, 10, [1, 1], null);
    mergePoint(buffer, 30, [3, 3], null);
    mergePoint(buffer, 20, [2, 2], null);
    expect(rows(buffer)[0]).toEqual([10, 20, 30]);
  });
});

describe('merging live samples into a min/max downsampled trend', () => {
  const bucketing = { originMs: 0, bucketMs: 60_000 };

  it('keeps two points per bucket: minima at the first slot, maxima at the last, as the server does', () => {
    const buffer = new RingBuffer(10, 2);
    mergePoint(buffer, 0, [5, 5], bucketing);
    mergePoint(buffer, 10, [7, 4], bucketing);
    mergePoint(buffer, 20, [3, 6], bucketing);
    expect(rows(buffer)).toEqual([
      [0, 20],
      [3, 7],
      [4, 6],
    ]);
  });

  it('starts a new bucket with one point and ignores unknown values in the extremes', () => {
    const buffer = new RingBuffer(10, 2);
    mergePoint(buffer, 0, [5, 5], bucketing);
    mergePoint(buffer, 30, [NaN, 9], bucketing);
    mergePoint(buffer, 60, [1, 1], bucketing);
    expect(rows(buffer)).toEqual([
      [0, 30, 60],
      [5, 5, 1],
      [5, 9, 1],
    ]);
  });

  it('merges the server’s own min/max pairs back into the same two points', () => {
    const buffer = new RingBuffer(10, 1);
    mergePoint(buffer, 0, [2], bucketing);
    mergePoint(buffer, 50, [8], bucketing);
    mergePoint(buffer, 55, [6], bucketing);
    expect(rows(buffer)).toEqual([
      [0, 55],
      [2, 8],
    ]);
  });
});
