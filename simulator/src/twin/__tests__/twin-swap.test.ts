import { describe, expect, it } from 'vitest';
import { resumePoint } from '../lease-keeper.js';
import { createLoopTwin } from '../loop-twin.js';
import { stepSlot } from '../twin-step.js';
import { swapLoopTwin } from '../twin-swap.js';
import { TANKS, activeModel, nextState } from './twin-fixtures.js';

const start = { next: 500, staleAfterSamples: 5 };

describe('hot swap at the next slot', () => {
  it('carries the state across when the new version has as many states, and steps with the new matrices', () => {
    const running = createLoopTwin(activeModel(TANKS), { ...start, x: [3.4, 2.2], u: [750], lastMeasuredK: 499 });
    const faster = {
      ...TANKS,
      A: [
        [0.5, 0],
        [0, 0.5],
      ],
    };
    const { twin, carried, reason } = swapLoopTwin(running, activeModel(faster, undefined, 2));
    expect(carried).toBe(true);
    expect(reason).toMatch(/carried/);
    expect(Array.from(twin.x)).toEqual([3.4, 2.2]);
    expect(twin.next).toBe(500);
    expect(twin.lastMeasuredK).toBe(499);
    expect(Array.from(twin.u)).toEqual([750]);
    stepSlot(twin, undefined);
    expect(Array.from(twin.x)).toEqual(nextState(faster, [3.4, 2.2], [750]));
  });

  it('re-initialises at the new operating point when the number of states changes, and says why', () => {
    const running = createLoopTwin(activeModel(TANKS), { ...start, x: [3.4, 2.2] });
    const three = {
      A: [
        [0.9, 0, 0],
        [0, 0.9, 0],
        [0, 0, 0.9],
      ],
      B: [
        [1, 0],
        [0, 1],
        [0, 0],
      ],
      x0: [1, 2, 3],
      u0: [4, 5],
    };
    const { twin, carried, reason } = swapLoopTwin(running, activeModel(three, undefined, 2));
    expect(carried).toBe(false);
    expect(reason).toMatch(/state dimension changed from 2 to 3/);
    expect(Array.from(twin.x)).toEqual([1, 2, 3]);
    expect(Array.from(twin.u)).toEqual([4, 5]); // two inputs now: the held single input means nothing
  });

  it('never lets the old and the new twin share a buffer', () => {
    const running = createLoopTwin(activeModel(TANKS), { ...start, x: [3.4, 2.2] });
    const { twin } = swapLoopTwin(running, activeModel(TANKS, undefined, 2));
    twin.x[0] = 99;
    expect(running.x[0]).toBe(3.4);
  });
});

describe('resuming a saved twin', () => {
  const saved = { versionId: 'version-1', k: 480, x: [3.1, 2.6], lastMeasuredK: 479 };

  it('continues at its own slot with its state', () => {
    expect(resumePoint(saved, 'version-1', 2, 500)).toEqual({ next: 480, x: [3.1, 2.6], why: undefined });
  });

  it('carries the state saved under another version of the same size, and says so', () => {
    expect(resumePoint(saved, 'version-2', 2, 500)).toMatchObject({
      next: 480,
      x: [3.1, 2.6],
      why: expect.stringMatching(/another version/),
    });
  });

  it('starts afresh at the current slot when the state no longer fits or the saved slot is ahead of the clock', () => {
    expect(resumePoint(saved, 'version-2', 3, 500)).toEqual({
      next: 500,
      why: expect.stringMatching(/2 states, the active version 3/),
    });
    expect(resumePoint({ ...saved, k: 900 }, 'version-1', 2, 500)).toEqual({
      next: 500,
      why: expect.stringMatching(/ahead of the clock/),
    });
    expect(resumePoint(undefined, 'version-1', 2, 500)).toEqual({ next: 500 });
  });
});
