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
    const loop = { samplePeriodS: 1, inputs: 1, outputs: 1 };
    expect(refusal(() => requireSlotLimit(BACKTEST_LIMITS.maxSamples, loop, 'The range'))).toBeNull();
    const refused = refusal(() => requireSlotLimit(BACKTEST_LIMITS.maxSamples + 1, loop, 'The range'));
    expect(refused).toMatchObject({ status: 422, code: 'recording_too_long' });
    expect(refused?.message).toBe(
      'The range spans 3,000,001 slots at 1 s; a backtest takes at most 3,000,000 slots (34.7 days at this sample period). Shorten it.',
    );
  });

  it("bounds slots × signals for a wide loop, so a backtest cannot fill the api's memory", () => {
    const wide = { samplePeriodS: 10, inputs: 20, outputs: 30 };
    expect(refusal(() => requireSlotLimit(600_000, wide, 'The file "week.csv"'))).toBeNull();
    const refused = refusal(() => requireSlotLimit(600_001, wide, 'The file "week.csv"'));
    expect(refused?.message).toBe(
      'The file "week.csv" spans 600,001 slots at 10 s; a backtest holds at most 30,000,000 values (slots × signals) ' +
        "in memory, which for this loop's 50 signals is 600,000 slots (69.4 days at this sample period). Shorten it.",
    );
  });
});
