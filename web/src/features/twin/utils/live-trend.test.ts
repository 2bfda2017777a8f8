import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Series, SeriesRequest } from '../api/get-series';
import { LiveTrend } from './live-trend';

const LOOP = { loopId: 'loop-1', samplePeriodS: 1, layout: { outputs: 1, inputs: 1 } };
const iso = (s: number) => new Date(s * 1000).toISOString();

/** A stored history of one reading per second with its prediction; the fake answers any window from it. */
function history(untilS: number) {
  return vi.fn(async (request: SeriesRequest): Promise<Series> => {
    const slots: number[] = [];
    for (let s = Math.ceil(request.fromMs / 1000); s <= Math.min(untilS, request.toMs / 1000); s++) slots.push(s);
    return {
      t: slots.map(iso),
      measured: [slots.map((s) => s + 0.5)],
      predicted: [slots.map((s) => s + 0.4)],
      residual: [slots.map(() => 0.1)],
      inputs: [slots.map(() => 50)],
      downsampled: false,
    };
  });
}

const sample = (s: number) => ({
  loopId: 'loop-1',
  t: iso(s),
  k: s,
  predicted: [s + 0.4],
  measured: [s + 0.5],
  residual: [0.1],
  status: 'in_step' as const,
});

afterEach(() => vi.useRealTimers());

describe('a live trend', () => {
  it('backfills the gap after a dropped connection, so no slot is missing', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(1_000_000_000);
    const fetchSeries = history(1_000_000);
    const trend = new LiveTrend(LOOP, { kind: 'live', key: '15m' }, 2000, fetchSeries);
    await trend.load();
    trend.accept(sample(1_000_001));
    // the connection drops for 20 s; the plant kept posting readings, which the api stored
    vi.setSystemTime(1_000_030_000);
    fetchSeries.mockImplementation(history(1_000_030));
    await trend.backfill();
    const [t, measured] = trend.rows();
    const tail = t.slice(-31);
    expect(tail).toEqual(Array.from({ length: 31 }, (_, i) => 1_000_000 + i));
    expect(measured.slice(-31).every((v) => v !== null)).toBe(true);
    expect(fetchSeries.mock.calls[1][0].fromMs).toBe(1_000_000_000);
  });

  it('keeps samples that arrive while the window loads and merges them after it', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(2_000_000_000);
    let answer: (series: Series) => void = () => undefined;
    const trend = new LiveTrend(
      LOOP,
      { kind: 'live', key: '15m' },
      2000,
      () => new Promise<Series>((resolve) => (answer = resolve)),
    );
    const loading = trend.load();
    trend.accept(sample(2_000_001));
    answer({
      t: [iso(2_000_000)],
      measured: [[1]],
      predicted: [[1]],
      residual: [[0]],
      inputs: [[50]],
      downsampled: false,
    });
    await loading;
    expect(trend.rows()[0]).toEqual([2_000_000, 2_000_001]);
    expect(trend.lastReading?.k).toBe(2_000_001);
  });

  it('ignores live samples in a fixed window', async () => {
    const trend = new LiveTrend(LOOP, { kind: 'fixed', fromMs: 0, toMs: 60_000 }, 500, history(10));
    await trend.load();
    trend.accept(sample(100));
    expect(trend.rows()[0].at(-1)).toBe(10);
  });
});
