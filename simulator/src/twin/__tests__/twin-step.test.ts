import { describe, expect, it } from 'vitest';
import { isStale, missingSamples, createLoopTwin } from '../loop-twin.js';
import { coast, jump, stepSlot } from '../twin-step.js';
import { TANKS, activeModel, nextState } from './twin-fixtures.js';

const start = { next: 10, staleAfterSamples: 3 };

describe('stepping a twin', () => {
  it('holds the newest inputs while readings are missing', () => {
    const twin = createLoopTwin(activeModel(TANKS), { ...start, x: [3, 2.5] });
    stepSlot(twin, { k: 10, u: [760], y: [3, 2.5] });
    const afterReading = Array.from(twin.x);
    stepSlot(twin, undefined);
    expect(Array.from(twin.x)).toEqual(nextState(TANKS, afterReading, [760]));
    expect(Array.from(twin.u)).toEqual([760]);
  });

  it('ignores a reading of the wrong size as if it were missing', () => {
    const twin = createLoopTwin(activeModel(TANKS), { ...start, x: [3, 2.5] });
    expect(stepSlot(twin, { k: 10, u: [760, 1], y: [3, 2.5] })).toBe(false);
    expect(Array.from(twin.u)).toEqual([720]);
  });

  it('turns stale after the configured number of slots without a reading, and back with the next reading', () => {
    const twin = createLoopTwin(activeModel(TANKS), start);
    stepSlot(twin, { k: 10, u: [720], y: [3, 2.5] });
    const seen: boolean[] = [];
    for (let k = 11; k <= 14; k++) {
      stepSlot(twin, undefined);
      seen.push(isStale(twin, k));
    }
    expect(seen).toEqual([false, false, true, true]);
    expect(missingSamples(twin, 14)).toBe(4);
    stepSlot(twin, { k: 15, u: [720], y: [3, 2.5] });
    expect(isStale(twin, 15)).toBe(false);
  });

  it('counts staleness from adoption when no reading was ever seen', () => {
    const twin = createLoopTwin(activeModel(TANKS), start);
    expect([10, 11, 12].map((k) => isStale(twin, k))).toEqual([false, false, true]);
  });

  it('coasts a gap on held inputs and jumps an older one with the state kept', () => {
    const twin = createLoopTwin(activeModel(TANKS), { ...start, x: [3.5, 2.5], u: [700] });
    let expected = [3.5, 2.5];
    for (let i = 0; i < 4; i++) expected = nextState(TANKS, expected, [700]);
    coast(twin, 4);
    expect(twin.next).toBe(14);
    Array.from(twin.x).forEach((v, i) => expect(v).toBeCloseTo(expected[i], 12));
    jump(twin, 100);
    expect(twin.next).toBe(114);
    Array.from(twin.x).forEach((v, i) => expect(v).toBeCloseTo(expected[i], 12));
  });
});
