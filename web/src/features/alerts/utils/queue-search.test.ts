import { describe, expect, it } from 'vitest';
import { queueFilters, readQueueSearch, writeQueueSearch } from './queue-search';

const NOW = Date.parse('2025-06-03T10:00:00Z');

describe('the queue filters in the address', () => {
  it('reads open alerts of every time, most urgent first, when nothing is said', () => {
    const search = readQueueSearch(new URLSearchParams());
    expect(queueFilters(search, NOW)).toEqual({
      states: ['open'],
      area: undefined,
      loopId: undefined,
      priorities: undefined,
      from: undefined,
      to: undefined,
      limit: 500,
      order: 'urgent',
    });
    expect(writeQueueSearch(search).toString()).toBe('');
  });

  it('keeps "newest first" in the address and then leaves the order to the server default', () => {
    const search = readQueueSearch(new URLSearchParams('order=newest'));
    expect(search.order).toBe('newest');
    expect(queueFilters(search, NOW)).not.toHaveProperty('order');
    expect(writeQueueSearch(search).toString()).toBe('order=newest');
  });

  it('reads states, priorities and a rolling range, and drops what it does not know', () => {
    const search = readQueueSearch(
      new URLSearchParams('state=shelved,nonsense&priority=3,1,9,1&range=7d&area=storage'),
    );
    const filters = queueFilters(search, NOW);
    expect(filters.states).toEqual(['shelved']);
    expect(filters.priorities).toEqual([1, 3]);
    expect(filters.area).toBe('storage');
    expect(filters.from).toBe('2025-05-27T10:00:00.000Z');
    expect(queueFilters(readQueueSearch(new URLSearchParams('state=all')), NOW).states).toBeUndefined();
  });

  it('keeps a custom range as instants and ignores text that is not a time', () => {
    const search = readQueueSearch(new URLSearchParams('from=2025-06-01T00:00:00Z&to=garbage'));
    expect(search.range).toBe('custom');
    expect(queueFilters(search, NOW)).toMatchObject({ from: '2025-06-01T00:00:00.000Z', to: undefined });
    expect(readQueueSearch(new URLSearchParams('from=soon')).range).toBe('any');
    expect(writeQueueSearch(search).toString()).toBe('from=2025-06-01T00%3A00%3A00.000Z');
  });
});
