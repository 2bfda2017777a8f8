import { describe, expect, it } from 'vitest';
import { fakeAlert } from '../testing/fake-alerts';
import { orderAlerts } from './alert-order';

describe('orderAlerts', () => {
  const waitingOld = fakeAlert({
    number: 1,
    state: 'unacknowledged',
    active: true,
    priority: 2,
    raisedAt: '2025-06-03T06:00:00Z',
  });
  const cleared = fakeAlert({
    number: 5,
    state: 'returned_unacknowledged',
    active: false,
    priority: 1,
    raisedAt: '2025-06-03T09:00:00Z',
  });
  const waitingHigh = fakeAlert({
    number: 2,
    state: 'unacknowledged',
    active: true,
    priority: 1,
    raisedAt: '2025-06-03T05:00:00Z',
  });
  const handled = fakeAlert({
    number: 6,
    state: 'acknowledged',
    active: true,
    priority: 1,
    raisedAt: '2025-06-03T09:30:00Z',
  });
  const shelved = fakeAlert({
    number: 7,
    state: 'shelved',
    active: true,
    priority: 1,
    raisedAt: '2025-06-03T09:40:00Z',
  });
  const newest = [shelved, handled, cleared, waitingOld, waitingHigh];

  it('puts the active alerts nobody acknowledged first, by priority, then those that cleared unacknowledged', () => {
    expect(orderAlerts(newest, 'urgent').map((a) => a.number)).toEqual([2, 1, 5, 6, 7]);
  });

  it('keeps the api order (newest raise first) when asked for the newest', () => {
    expect(orderAlerts(newest, 'newest')).toBe(newest);
  });
});
