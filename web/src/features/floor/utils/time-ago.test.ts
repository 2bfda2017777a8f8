import { describe, expect, it } from 'vitest';
import { worstBandFraction, percentOfBand } from './band-use';
import { newest, timeAgo } from './time-ago';

const NOW = Date.parse('2025-03-01T08:00:00Z');

describe('reading age in a tile', () => {
  it('says it in the unit a person would use', () => {
    expect(timeAgo(NOW - 3_000, NOW)).toBe('3 s ago');
    expect(timeAgo(NOW - 400, NOW)).toBe('just now');
    expect(timeAgo(NOW + 2_000, NOW)).toBe('just now');
    expect(timeAgo(NOW - 119_000, NOW)).toBe('119 s ago');
    expect(timeAgo(NOW - 4 * 60_000, NOW)).toBe('4 min ago');
    expect(timeAgo(NOW - 3 * 3_600_000, NOW)).toBe('3 h ago');
    expect(timeAgo(NOW - 3 * 86_400_000, NOW)).toBe('3 days ago');
    expect(timeAgo(null, NOW)).toBe('no reading yet');
  });

  it('takes the newer of the list’s time and the newest live sample', () => {
    expect(newest(null, 5)).toBe(5);
    expect(newest(7, 5)).toBe(7);
    expect(newest(null, null)).toBeNull();
  });
});

describe('residual as a share of its band', () => {
  it('takes the worst output and skips outputs without a band', () => {
    expect(worstBandFraction([0.5, -3], [1, 2])).toBe(1.5);
    expect(worstBandFraction([0.5, -3], [1, null])).toBe(0.5);
    expect(worstBandFraction([0.5], [null])).toBeNull();
    expect(percentOfBand(0.384)).toBe('38 %');
  });
});
