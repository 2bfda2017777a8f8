import { z } from 'zod';
import { TrackingStatusSchema } from './registry.js';

/** What the live twin answers: trends (series), forecasts and move previews, tracking fields. */
const Iso = z.iso.datetime({ offset: true });
const Trace = z.array(z.array(z.number().nullable()));

export const SeriesQuerySchema = z.object({
  from: Iso.optional(),
  to: Iso.optional(),
  /** About this many points come back: min and max of each time bucket when the range holds more samples. */
  maxPoints: z.coerce.number().int().min(10).max(20_000).default(2000),
});

/** One inner array per signal, aligned with t (slot times, ISO 8601 UTC); null where nothing was stored. */
export const SeriesSchema = z.object({
  t: z.array(z.string()),
  measured: Trace,
  predicted: Trace,
  residual: Trace,
  inputs: Trace,
  /** True when the range held more samples than maxPoints and min/max buckets came back. */
  downsampled: z.boolean(),
});
export type Series = z.infer<typeof SeriesSchema>;

export const ForecastQuerySchema = z.object({ n: z.coerce.number().int().min(1).max(2000).default(60) });
export const MovePreviewBodySchema = z.object({
  inputIndex: z.number().int().min(0),
  delta: z.number().refine(Number.isFinite, 'delta must be a finite number'),
  n: z.number().int().min(1).max(2000).default(60),
});

const Trajectory = z.object({
  /** Slot times k+1 … k+n after the twin's state (ISO 8601 UTC). */
  t: z.array(z.string()),
  /** One inner array per output. */
  y: z.array(z.array(z.number())),
  /** One inner array per state. */
  x: z.array(z.array(z.number())),
});

export const ForecastSchema = Trajectory.extend({
  loopId: z.uuid(),
  versionId: z.uuid(),
  /** The slot of the twin's persisted state the forecast starts from. */
  k: z.number().int(),
  /** The inputs held over the horizon (the newest reading's, else the operating point). */
  u: z.array(z.number()),
});
export type Forecast = z.infer<typeof ForecastSchema>;

export const MovePreviewSchema = ForecastSchema.extend({
  inputIndex: z.number().int(),
  delta: z.number(),
  /** The forecast with the inputs held, for comparison. */
  baseline: Trajectory,
});
export type MovePreview = z.infer<typeof MovePreviewSchema>;

/** Fields the loop list and loop page add from loop_tracking. */
export const LoopTrackingFieldsSchema = z.object({
  status: TrackingStatusSchema,
  lastReadingAt: z.string().nullable(),
  worstBandFraction: z.number().nullable(),
});
export type LoopTrackingFields = z.infer<typeof LoopTrackingFieldsSchema>;

/** A loop's tracking in full: what the trend page needs to draw the residual band. */
export const LoopTrackingSchema = LoopTrackingFieldsSchema.extend({
  loopId: z.uuid(),
  lastSlotAt: z.string().nullable(),
  lastResidual: z.array(z.number()).nullable(),
  residualCount: z.number().int(),
  residualMean: z.array(z.number()).nullable(),
  residualSd: z.array(z.number()).nullable(),
  /** Per output: the configured band, else 3 running sd once 30 residuals are known; null while unknown. */
  band: z.array(z.number().nullable()),
});
export type LoopTracking = z.infer<typeof LoopTrackingSchema>;
