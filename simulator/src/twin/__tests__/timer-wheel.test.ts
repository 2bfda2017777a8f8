import { describe, expect, it } from 'vitest';
import { createTimerWheel } from '../timer-wheel.js';
import { catchUpPlan, dueAtMs, lastDueSlot } from '../slot-clock.js';

const START = 1_800_000_000_000; // a round epoch millisecond, so the slot grids line up

describe('timer wheel', () => {
  it('fires loops of mixed sample periods once per slot, each at its slot plus the grace', () => {
    const periods = { fast: 1000, odd: 2500, slow: 10_000, minute: 60_000, tenth: 100 };
    const resolution = 50;
    const wheel = createTimerWheel({ resolutionMs: resolution, buckets: 64, startMs: START });
    const grace = (p: number) => 0.3 * p;
    const next = new Map<string, number>();
    for (const [key, p] of Object.entries(periods)) {
      const k = lastDueSlot(START, p, grace(p)) + 1;
      next.set(key, k);
      wheel.schedule(key, dueAtMs(k, p, grace(p)));
    }
    const fired = new Map<string, number[]>();
    for (let now = START; now <= START + 120_000; now += resolution) {
      for (const key of wheel.advance(now)) {
        const p = periods[key as keyof typeof periods];
        const k = next.get(key) as number;
        // never early, and late by less than one tick of the wheel
        expect(now).toBeGreaterThanOrEqual(dueAtMs(k, p, grace(p)));
        expect(now - dueAtMs(k, p, grace(p))).toBeLessThan(resolution);
        fired.set(key, [...(fired.get(key) ?? []), k]);
        next.set(key, k + 1);
        wheel.schedule(key, dueAtMs(k + 1, p, grace(p)));
      }
    }
    expect(fired.get('tenth')).toHaveLength(1200);
    expect(fired.get('fast')).toHaveLength(120);
    expect(fired.get('odd')).toHaveLength(48);
    expect(fired.get('slow')).toHaveLength(12);
    expect(fired.get('minute')).toHaveLength(2);
    for (const slots of fired.values()) expect(slots).toEqual(slots.map((_, i) => slots[0] + i));
  });

  it('keeps an entry due more than one turn ahead until its own turn', () => {
    const wheel = createTimerWheel({ resolutionMs: 10, buckets: 8, startMs: START });
    wheel.schedule('far', START + 1005); // 100 ticks ahead on a wheel of 8 buckets
    for (let now = START; now < START + 1000; now += 10) expect(wheel.advance(now)).toEqual([]);
    expect(wheel.advance(START + 1010)).toEqual(['far']);
    expect(wheel.size()).toBe(0);
  });

  it('forgets the old due time of a key that was rescheduled or cancelled', () => {
    const wheel = createTimerWheel({ resolutionMs: 10, buckets: 16, startMs: START });
    wheel.schedule('moved', START + 20);
    wheel.schedule('moved', START + 200);
    wheel.schedule('gone', START + 30);
    wheel.cancel('gone');
    expect(wheel.advance(START + 100)).toEqual([]);
    expect(wheel.advance(START + 200)).toEqual(['moved']);
  });

  it('fires an entry scheduled in the past on the next advance', () => {
    const wheel = createTimerWheel({ resolutionMs: 10, buckets: 16, startMs: START });
    wheel.advance(START + 500);
    wheel.schedule('late', START + 100);
    expect(wheel.advance(START + 510)).toEqual(['late']);
  });

  it('after a long pause returns every overdue key once and keeps the rest', () => {
    const wheel = createTimerWheel({ resolutionMs: 50, buckets: 32, startMs: START });
    for (let i = 0; i < 200; i++) wheel.schedule(`loop-${i}`, START + 100 + i * 7);
    wheel.schedule('tomorrow', START + 86_400_000);
    const due = wheel.advance(START + 10 * 60_000); // ten minutes with the event loop blocked
    expect(new Set(due).size).toBe(200);
    expect(due).toHaveLength(200);
    expect(wheel.size()).toBe(1);
    expect(wheel.dueAt('tomorrow')).toBe(START + 86_400_000);
  });
});

describe('catch-up plan', () => {
  const limits = { maxStepped: 30, maxCoasted: 50 };

  it('steps just the due slot when nothing was missed', () => {
    expect(catchUpPlan(100, 100, limits)).toEqual({ coast: 0, jump: 0, stepFrom: 100, stepTo: 100 });
  });

  it('steps every missed slot with its reading after a short pause', () => {
    expect(catchUpPlan(100, 109, limits)).toEqual({ coast: 0, jump: 0, stepFrom: 100, stepTo: 109 });
  });

  it('bounds the work after a long pause: the newest slots stepped, older coasted, the rest jumped', () => {
    const plan = catchUpPlan(100, 1099, limits);
    expect(plan).toEqual({ coast: 50, jump: 920, stepFrom: 1070, stepTo: 1099 });
    expect(plan.jump + plan.coast + (plan.stepTo - plan.stepFrom + 1)).toBe(1000);
  });

  it('has nothing to do before the next slot is due', () => {
    const plan = catchUpPlan(100, 99, limits);
    expect(plan.stepTo).toBeLessThan(plan.stepFrom);
  });
});
