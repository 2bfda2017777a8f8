import { describe, expect, it } from 'vitest';
import { countWindows, resolveLoadRange } from '../load-range.js';

const now = new Date('2025-03-08T12:34:56.000Z');
const d = (iso: string) => new Date(iso);

describe('resolveLoadRange', () => {
  it('defaults to the seven days up to now', () => {
    expect(resolveLoadRange({}, now)).toEqual({ from: d('2025-03-01T12:34:56.000Z'), to: now });
  });

  it('counts seven days back from a given end, and takes both ends as given', () => {
    expect(resolveLoadRange({ to: '2025-03-03T00:00:00Z' }, now).from).toEqual(d('2025-02-24T00:00:00Z'));
    expect(resolveLoadRange({ from: '2025-03-01T00:00:00Z', to: '2025-03-02T00:00:00Z' }, now)).toEqual({
      from: d('2025-03-01T00:00:00Z'),
      to: d('2025-03-02T00:00:00Z'),
    });
  });

  it('refuses an empty or reversed period and one longer than 92 days, naming query.from', () => {
    for (const query of [
      { from: '2025-03-02T00:00:00Z', to: '2025-03-02T00:00:00Z' },
      { from: '2025-03-09T00:00:00Z' },
      { from: '2024-11-01T00:00:00Z', to: '2025-03-01T00:00:00Z' },
    ]) {
      expect(() => resolveLoadRange(query, now)).toThrow(
        expect.objectContaining({ status: 400, details: [expect.objectContaining({ path: 'query.from' })] }),
      );
    }
  });
});

describe('countWindows', () => {
  it('counts the 10-minute windows of an aligned period', () => {
    // two days of 144 windows each
    expect(countWindows({ from: d('2025-03-01T00:00:00Z'), to: d('2025-03-03T00:00:00Z') })).toBe(288);
  });

  it('counts partial windows at either end', () => {
    // 00:05–00:25 touches the windows at 00:00, 00:10 and 00:20
    expect(countWindows({ from: d('2025-03-01T00:05:00Z'), to: d('2025-03-01T00:25:00Z') })).toBe(3);
    expect(countWindows({ from: d('2025-03-01T00:05:00Z'), to: d('2025-03-01T00:06:00Z') })).toBe(1);
  });
});
