import { describe, expect, it } from 'vitest';
import { nextSampleBoundary, parseActivationNotice, swapTwin, type ActiveModel, type TwinSlot } from '../hot-swap.js';

function activeModel(versionNumber: number, states: number, x0?: number[]): ActiveModel {
  const A = Array.from({ length: states }, (_, i) => Array.from({ length: states }, (_, j) => (i === j ? 0.9 : 0)));
  return {
    loopId: 'loop-1',
    loopTag: 'TEST-LOOP-1',
    samplePeriodS: 2,
    version: { id: `version-${versionNumber}`, number: versionNumber },
    model: { A, B: A.map(() => [0.1]), ...(x0 ? { x0 } : {}) },
    correction: { mode: 'free_run', K: null },
  };
}

const running = (active: ActiveModel, x: number[], k: number): TwinSlot => ({ ...active, x, k });

describe('swapTwin', () => {
  it('carries the state across when the new version has as many states', () => {
    const current = running(activeModel(1, 2, [5, 6]), [5.5, 6.25], 40);
    const result = swapTwin(current, activeModel(2, 2, [1, 1]), 41);
    expect(result.carried).toBe(true);
    expect(result.twin.x).toEqual([5.5, 6.25]);
    expect(result.twin.version.number).toBe(2);
    expect(result.twin.k).toBe(41);
    expect(result.reason).toContain('carried');
  });

  it('copies the carried state, so the old twin and the new one never share an array', () => {
    const current = running(activeModel(1, 1), [3], 0);
    const result = swapTwin(current, activeModel(2, 1), 1);
    result.twin.x[0] = 99;
    expect(current.x).toEqual([3]);
  });

  it('re-initialises at the new operating point and says why when the state dimension changes', () => {
    const current = running(activeModel(1, 2), [5.5, 6.25], 40);
    const result = swapTwin(current, activeModel(2, 3, [7, 8, 9]), 41);
    expect(result.carried).toBe(false);
    expect(result.twin.x).toEqual([7, 8, 9]);
    expect(result.reason).toMatch(/state dimension changed from 2 to 3/);
  });

  it('starts at zero deviation when the new version has no operating-point state', () => {
    const result = swapTwin(running(activeModel(1, 1), [2], 0), activeModel(2, 2), 1);
    expect(result.twin.x).toEqual([0, 0]);
  });

  it('starts a first twin from its operating point', () => {
    const result = swapTwin(undefined, activeModel(1, 2, [1.5, 2.5]), 10);
    expect(result).toMatchObject({ carried: false, twin: { x: [1.5, 2.5], k: 10 } });
    expect(result.reason).toMatch(/no twin was running/);
  });
});

describe('nextSampleBoundary', () => {
  it('is the next multiple of the sample period, strictly after now', () => {
    expect(nextSampleBoundary(10_500, 2)).toEqual({ k: 6, atMs: 12_000 });
    expect(nextSampleBoundary(12_000, 2)).toEqual({ k: 7, atMs: 14_000 });
  });

  it('honours the grid origin and fractional periods', () => {
    expect(nextSampleBoundary(1_000, 0.25, 900)).toEqual({ k: 1, atMs: 1_150 });
  });
});

describe('parseActivationNotice', () => {
  it('reads the loop and the version, null when none is active', () => {
    expect(parseActivationNotice('{"loopId":"a","versionId":"b"}')).toEqual({ loopId: 'a', versionId: 'b' });
    expect(parseActivationNotice('{"loopId":"a","versionId":null}')).toEqual({ loopId: 'a', versionId: null });
  });

  it('ignores payloads that are not activation notices', () => {
    expect(parseActivationNotice('not json')).toBeUndefined();
    expect(parseActivationNotice('{"versionId":"b"}')).toBeUndefined();
    expect(parseActivationNotice(undefined)).toBeUndefined();
  });
});
