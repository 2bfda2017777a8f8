import { describe, expect, it } from 'vitest';
import { BACKTEST_LIMITS } from '../../../contracts/backtests.js';
import { requireSlotLimit } from '../backtests.service.js';

const refusal = (run: () => void) => {
  try {
    run();
  } catch (error) {
    return error as { status: number; code: string; message: string };
  }
  return null;
};

describe('requireSlotLimit', () => {
  it('takes up to maxSamples slots of a small loop and refuses one more, with the days it means', () => {
    const loop = { samplePeriodS: 1, inputs: 1, outputs: 1, versions: 4 };
    expect(refusal(() => requireSlotLimit(BACKTEST_LIMITS.maxSamples, loop, 'The range'))).toBeNull();
    const refused = refusal(() => requireSlotLimit(BACKTEST_LIMITS.maxSamples + 1, loop, 'The range'));
    expect(refused).toMatchObject({ status: 422, code: 'recording_too_long' });
    expect(refused?.message).toBe(
      'The range spans 3,000,001 slots at 1 s; a backtest takes at most 3,000,000 slots (34.7 days at this sample period). Shorten it.',
    );
  });

  it("bounds the values a wide loop's backtest holds, so it cannot fill the api's memory", () => {
    // per slot: 1 + 20 inputs + 30 outputs × (1 + 2 × 2 versions) = 171 values; 40,000,000 / 171 = 233,918 slots
    const wide = { samplePeriodS: 10, inputs: 20, outputs: 30, versions: 2 };
    expect(refusal(() => requireSlotLimit(233_918, wide, 'The file "week.csv"'))).toBeNull();
    const refused = refusal(() => requireSlotLimit(233_919, wide, 'The file "week.csv"'));
    expect(refused?.message).toBe(
      'The file "week.csv" spans 233,919 slots at 10 s; a backtest holds at most 40,000,000 values in memory ' +
        "(per slot its inputs and outputs and two replays of the outputs per version), which for this loop's 50 " +
        'signals and 2 versions is 233,918 slots (27.1 days at this sample period). Shorten it.',
    );
  });
});
