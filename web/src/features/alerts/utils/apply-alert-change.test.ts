import { describe, expect, it } from 'vitest';
import { fakeAlert } from '../testing/fake-alerts';
import { applyAlertToDetail, applyAlertToList } from './apply-alert-change';

describe('a pushed alert in a cached list', () => {
  const older = fakeAlert({ number: 1, raisedAt: '2025-06-03T08:00:00Z' });
  const newer = fakeAlert({ number: 2, raisedAt: '2025-06-03T09:00:00Z' });

  it('replaces the alert where it was and keeps the list newest first', () => {
    const changed = { ...older, state: 'acknowledged' as const };
    expect(applyAlertToList([newer, older], changed, { states: ['open'] })).toEqual([newer, changed]);
  });

  it('adds a new alert that belongs, newest first, and cuts the list at its limit', () => {
    const latest = fakeAlert({ number: 3, raisedAt: '2025-06-03T10:00:00Z' });
    expect(applyAlertToList([newer, older], latest, { limit: 2 })).toEqual([latest, newer]);
  });

  it('drops an alert that left the filter and ignores one that never matched', () => {
    const waiting = { states: ['unacknowledged' as const] };
    const list = [newer, older];
    expect(applyAlertToList(list, { ...older, state: 'shelved' }, waiting)).toEqual([newer]);
    expect(applyAlertToList(list, fakeAlert({ area: 'storage' }), { area: 'aeration' })).toBe(list);
    expect(applyAlertToList(list, fakeAlert({ priority: 3 }), { priorities: [1, 2] })).toBe(list);
    expect(
      applyAlertToList(list, fakeAlert({ raisedAt: '2025-06-01T00:00:00Z' }), { from: '2025-06-02T00:00:00Z' }),
    ).toBe(list);
  });

  it('keeps a detail newer than the pushed alert, and its timeline either way', () => {
    const detail = { ...newer, updatedAt: '2025-06-03T09:05:00Z', events: [] };
    expect(applyAlertToDetail(detail, { ...newer, state: 'closed', updatedAt: '2025-06-03T09:01:00Z' })).toBe(detail);
    const merged = applyAlertToDetail(detail, { ...newer, state: 'closed', updatedAt: '2025-06-03T09:06:00Z' });
    expect(merged?.state).toBe('closed');
    expect(merged?.events).toBe(detail.events);
  });
});
