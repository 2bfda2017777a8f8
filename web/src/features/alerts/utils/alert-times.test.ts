import { describe, expect, it } from 'vitest';
import { conditionDuration, conditionWord } from './alert-times';

const activeSince = '2026-12-02T06:00:00Z';
const now = Date.parse('2026-12-02T09:00:00Z');

describe('the condition of an alert in words', () => {
  it('counts an active condition up to now, a cleared one up to its clearing, from its latest raise', () => {
    const active = { active: true, activeSince, clearedAt: null, closedAt: null };
    expect([conditionWord(active), conditionDuration(active, now)]).toEqual(['active', '3 h so far']);
    const cleared = { active: false, activeSince, clearedAt: '2026-12-02T07:30:00Z', closedAt: '2026-12-02T08:00:00Z' };
    expect([conditionWord(cleared), conditionDuration(cleared, now)]).toEqual(['cleared', '1.5 h, then cleared']);
  });

  it('says an alert closed while its condition was present stopped there, not that it cleared', () => {
    const closed = { active: false, activeSince, clearedAt: null, closedAt: '2026-12-02T08:30:00Z' };
    expect([conditionWord(closed), conditionDuration(closed, now)]).toEqual([
      'closed before it cleared',
      '2.5 h, then closed',
    ]);
  });
});
