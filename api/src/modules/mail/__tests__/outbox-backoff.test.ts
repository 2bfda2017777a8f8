import { describe, expect, it } from 'vitest';
import { retryDelayMs } from '../outbox-sender.js';

describe('outbox retry delay', () => {
  it('doubles from the base delay with each failed attempt', () => {
    expect([1, 2, 3, 4, 5].map((attempts) => retryDelayMs(attempts, 5000, 300_000))).toEqual([
      5000, 10_000, 20_000, 40_000, 80_000,
    ]);
  });

  it('stops growing at the maximum', () => {
    expect(retryDelayMs(7, 5000, 300_000)).toBe(300_000);
    expect(retryDelayMs(60, 5000, 300_000)).toBe(300_000);
  });

  it('waits the base delay before the first retry even when attempts were not counted', () => {
    expect(retryDelayMs(0, 100, 1000)).toBe(100);
  });
});
