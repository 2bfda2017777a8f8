import { describe, expect, it } from 'vitest';
import { RingBuffer } from './ring-buffer';

const times = (buffer: RingBuffer) => buffer.toAlignedData()[0];

describe('RingBuffer', () => {
  it('keeps rows oldest first and never holds more than its capacity', () => {
    const buffer = new RingBuffer(3, 1);
    for (let t = 1; t <= 5; t++) buffer.push(t, [t * 10]);
    expect(buffer.length).toBe(3);
    expect(buffer.toAlignedData()).toEqual([
      [3, 4, 5],
      [30, 40, 50],
    ]);
    expect(buffer.timeAt(0)).toBe(5);
    expect(buffer.valueAt(2, 0)).toBe(30);
  });

  it('stores missing values as NaN and hands them to uPlot as null gaps', () => {
    const buffer = new RingBuffer(4, 2);
    buffer.push(1, [1, NaN]);
    buffer.push(2, [2]);
    expect(buffer.toAlignedData()).toEqual([
      [1, 2],
      [1, 2],
      [null, null],
    ]);
  });

  it('slots a late row in between and keeps order when it wraps around', () => {
    const buffer = new RingBuffer(4, 1);
    [10, 20, 40, 50].forEach((t) => buffer.push(t, [t]));
    buffer.insertOlderThan(1, 30, [30]);
    expect(times(buffer)).toEqual([20, 30, 40, 50]);
    buffer.insertOlderThan(0, 45, [45]);
    expect(buffer.toAlignedData()).toEqual([
      [30, 40, 45, 50],
      [30, 40, 45, 50],
    ]);
  });

  it('overwrites a row in place and forgets everything on clear', () => {
    const buffer = new RingBuffer(2, 1);
    buffer.push(1, [1]);
    buffer.set(0, 1, [7]);
    expect(buffer.valueAt(0, 0)).toBe(7);
    buffer.clear();
    expect(buffer.length).toBe(0);
    expect(times(buffer)).toEqual([]);
  });

  it('refuses rows it does not hold and sizes that make no sense', () => {
    const buffer = new RingBuffer(2, 1);
    buffer.push(1, [1]);
    expect(() => buffer.timeAt(1)).toThrow(RangeError);
    expect(() => new RingBuffer(0, 1)).toThrow(/capacity/);
  });
});
