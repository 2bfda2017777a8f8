import { RingBuffer } from '../../../lib/ring-buffer';
import type { TwinSample } from '../../../lib/socket';
import { getSeries, type Series, type SeriesRequest } from '../api/get-series';
import type { TrendOverlays } from './chart-data';
import { mergePoint, type Bucketing } from './merge-point';
import { columnCount, pointRow, sampleRow, secondsOf, seriesPoints, type TrendLayout } from './trend-layout';
import { bucketingFor, capacityFor, spanOf, windowOf, type TrendRange } from './trend-window';

export interface TrendSource {
  loopId: string;
  samplePeriodS: number;
  layout: TrendLayout;
}

export type AlignedRows = [number[], ...(number | null)[][]];
export type { TrendOverlays };

type FetchSeries = (request: SeriesRequest, signal?: AbortSignal) => Promise<Series>;

/**
 * One loop's trend outside React: a ring buffer filled from GET …/series and extended by live
 * twin samples, which tells its charts to redraw at most once per animation frame. Samples that
 * arrive while the window loads wait and are merged after it, so none is lost.
 */
export class LiveTrend {
  readonly buffer: RingBuffer;
  readonly live: boolean;
  private bucketing: Bucketing = null;
  private waiting: TwinSample[] | null = [];
  private paused = false;
  private frame: number | null = null;
  private cache: AlignedRows | null = null;
  private readonly listeners = new Set<() => void>();
  lastMeasuredMs: number | null = null;
  /** The newest live sample with a reading in it (its residual and status), for tiles. */
  lastReading: TwinSample | null = null;
  overlays: TrendOverlays = { bands: [], forecast: null, preview: null };

  constructor(
    readonly source: TrendSource,
    readonly range: TrendRange,
    readonly maxPoints: number,
    private readonly fetchSeries: FetchSeries = getSeries,
  ) {
    this.buffer = new RingBuffer(
      capacityFor(spanOf(range), source.samplePeriodS, maxPoints),
      columnCount(source.layout),
    );
    this.live = range.kind === 'live';
  }

  async load(signal?: AbortSignal): Promise<void> {
    const window = windowOf(this.range, Date.now());
    const series = await this.fetchSeries({ loopId: this.source.loopId, ...window, maxPoints: this.maxPoints }, signal);
    this.buffer.clear();
    this.bucketing = series.downsampled ? bucketingFor(window, this.source.samplePeriodS, this.maxPoints) : null;
    this.mergeSeries(series);
    const waiting = this.waiting ?? [];
    this.waiting = null;
    waiting.forEach((sample) => this.mergeSample(sample));
    this.changed();
  }

  /** What was stored while the connection was down (or what the socket does not carry): no gap. */
  async backfill(signal?: AbortSignal): Promise<void> {
    if (!this.live || this.waiting) return;
    const toMs = Date.now();
    const windowStart = windowOf(this.range, toMs).fromMs;
    const fromMs = Math.max(windowStart, (this.lastMeasuredMs ?? windowStart) - this.source.samplePeriodS * 1000);
    this.mergeSeries(
      await this.fetchSeries({ loopId: this.source.loopId, fromMs, toMs, maxPoints: this.maxPoints }, signal),
    );
    this.changed();
  }

  accept(sample: TwinSample): void {
    if (!this.live) return;
    if (this.waiting) {
      if (this.waiting.length < this.buffer.capacity) this.waiting.push(sample);
      return;
    }
    this.mergeSample(sample);
    this.changed();
  }

  setPaused(paused: boolean): void {
    this.paused = paused;
    if (!paused) this.redraw();
  }

  isPaused(): boolean {
    return this.paused;
  }

  setOverlays(change: Partial<TrendOverlays>): void {
    this.overlays = { ...this.overlays, ...change };
    this.redraw();
  }

  /** The x window in seconds: the range (following now when live), on into any forecast. */
  xRange(nowMs = Date.now()): [number, number] {
    const { fromMs, toMs } = windowOf(this.range, nowMs);
    if (!this.live) return [fromMs / 1000, toMs / 1000];
    const ahead = [this.overlays.forecast, this.overlays.preview].flatMap((o) =>
      o?.t.length ? [o.t[o.t.length - 1]] : [],
    );
    return [fromMs / 1000, Math.max(toMs / 1000, ...ahead)];
  }

  /** Oldest first, NaN as null; rebuilt only after a change. */
  rows(): AlignedRows {
    this.cache ??= this.buffer.toAlignedData();
    return this.cache;
  }

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Asks the charts to draw again (new overlays, or the window moved on) unless paused. */
  redraw(): void {
    if (this.paused || this.frame !== null) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = null;
      this.listeners.forEach((listener) => listener());
    });
  }

  /** Stops a pending draw; charts unsubscribe themselves. */
  dispose(): void {
    if (this.frame !== null) cancelAnimationFrame(this.frame);
    this.frame = null;
  }

  private changed(): void {
    this.cache = null;
    this.redraw();
  }

  private mergeSample(sample: TwinSample): void {
    const t = secondsOf(sample.t);
    mergePoint(this.buffer, t, sampleRow(this.source.layout, sample), this.bucketing);
    if (!sample.measured) return;
    this.noteMeasured(t * 1000);
    if (!this.lastReading || sample.t >= this.lastReading.t) this.lastReading = sample;
  }

  private mergeSeries(series: Series): void {
    const row = new Float64Array(this.buffer.columns);
    for (const { ms, point } of seriesPoints(series)) {
      mergePoint(this.buffer, ms / 1000, pointRow(this.source.layout, point, row), this.bucketing);
      if (point.measured.some((v) => v !== null)) this.noteMeasured(ms);
    }
  }

  private noteMeasured(ms: number): void {
    this.lastMeasuredMs = Math.max(this.lastMeasuredMs ?? ms, ms);
  }
}
