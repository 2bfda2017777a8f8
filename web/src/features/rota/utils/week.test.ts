import { describe, expect, it } from 'vitest';
import { addDays, mondayOf, segmentOn, weekDays } from './week';

describe('the plant week', () => {
  it('finds the Monday of a week, across a month end', () => {
    expect(mondayOf('2025-06-01')).toBe('2025-05-26');
    expect(mondayOf('2025-06-02')).toBe('2025-06-02');
    expect(mondayOf('2025-06-08')).toBe('2025-06-02');
    expect(addDays('2025-12-29', 7)).toBe('2026-01-05');
  });

  it("counts the days by the plant's clock, a clock-change day 23 hours long", () => {
    // Europe/London moved from GMT to BST at 01:00 UTC on Sunday 30 March 2025.
    const days = weekDays('2025-03-24', 'Europe/London');
    expect(days.map((d) => d.label)).toEqual([
      'Mon 24 Mar',
      'Tue 25 Mar',
      'Wed 26 Mar',
      'Thu 27 Mar',
      'Fri 28 Mar',
      'Sat 29 Mar',
      'Sun 30 Mar',
    ]);
    expect(days[0].startMs).toBe(Date.parse('2025-03-24T00:00:00Z'));
    expect((days[6].endMs - days[6].startMs) / 3_600_000).toBe(23);
  });

  it('places the part of a shift that falls on a day by its hours', () => {
    const [monday, tuesday, wednesday] = weekDays('2025-06-02', 'UTC');
    const shift = { startsAt: '2025-06-02T18:00:00Z', endsAt: '2025-06-03T06:00:00Z' };
    expect(segmentOn(shift, monday)).toEqual({
      leftPercent: 75,
      widthPercent: 25,
      startsBefore: false,
      endsAfter: true,
    });
    expect(segmentOn(shift, tuesday)).toEqual({
      leftPercent: 0,
      widthPercent: 25,
      startsBefore: true,
      endsAfter: false,
    });
    expect(segmentOn(shift, wednesday)).toBeNull();
  });
});
