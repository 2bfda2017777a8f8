import { z } from 'zod';

export * from './model-tools.js';

/**
 * Loops and model versions (the registry). Matrices arrive loosely typed on purpose: the engine's
 * validateModel reports every problem with its place, which a schema would cut short.
 */
export const TAG_PATTERN = /^[A-Z][A-Z0-9]*(?:[-_.][A-Z0-9]+)*$/;

export const SignalSchema = z.object({
  name: z.string().trim().min(1).max(40),
  unit: z.string().trim().max(20),
});
export type Signal = z.infer<typeof SignalSchema>;

export const OperatingPointSchema = z.object({
  x0: z.array(z.number()).optional(),
  u0: z.array(z.number()).optional(),
  y0: z.array(z.number()).optional(),
});

export const AreaSchema = z.object({ id: z.string(), name: z.string() });
export type Area = z.infer<typeof AreaSchema>;

export const TRACKING_STATUSES = ['in_step', 'drifting', 'diverged', 'stale', 'no_twin'] as const;
export const TrackingStatusSchema = z.enum(TRACKING_STATUSES);

const LOOP_FIELDS = {
  tag: z
    .string()
    .trim()
    .max(40)
    .regex(TAG_PATTERN, 'use capitals, digits and single - _ . separators, e.g. AER-DO-101'),
  name: z.string().trim().min(1).max(120),
  area: z.string().min(1),
  description: z.string().max(2000),
  samplePeriodS: z.number().positive().max(86_400),
  inputs: z.array(SignalSchema).min(1).max(50),
  states: z.array(SignalSchema).min(1).max(200),
  outputs: z.array(SignalSchema).min(1).max(50),
  operatingPoint: OperatingPointSchema,
  /** An IANA time zone of the plant, e.g. Europe/London. */
  timeZone: z.string().min(1).max(64),
};

export const CreateLoopBodySchema = z.object({
  ...LOOP_FIELDS,
  description: LOOP_FIELDS.description.default(''),
  operatingPoint: LOOP_FIELDS.operatingPoint.default({}),
  timeZone: LOOP_FIELDS.timeZone.default('UTC'),
});
export type CreateLoopBody = z.input<typeof CreateLoopBodySchema>;
/** Only the fields sent change (no defaults here, so a PATCH never resets what it does not name). */
export const UpdateLoopBodySchema = z.object(LOOP_FIELDS).partial();
export type UpdateLoopBody = z.input<typeof UpdateLoopBodySchema>;

export const LoopListQuerySchema = z.object({
  area: z.string().max(40).optional(),
  status: TrackingStatusSchema.optional(),
});

export const LoopSchema = z.object({
  id: z.uuid(),
  tag: z.string(),
  name: z.string(),
  area: z.string(),
  areaName: z.string(),
  description: z.string(),
  samplePeriodS: z.number(),
  inputs: z.array(SignalSchema),
  states: z.array(SignalSchema),
  outputs: z.array(SignalSchema),
  operatingPoint: OperatingPointSchema,
  timeZone: z.string(),
  status: TrackingStatusSchema,
  /** The newest reading's time, and max |r_i| / band_i of its residual (null while no band is known). */
  lastReadingAt: z.string().nullable(),
  worstBandFraction: z.number().nullable(),
  activeVersionId: z.uuid().nullable(),
  /** In maintenance, drift rules still judge the readings and raises are recorded, but nobody is called. */
  maintenance: z.boolean(),
  activeVersionNumber: z.number().int().nullable(),
  draftCount: z.number().int(),
  inReviewCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Loop = z.infer<typeof LoopSchema>;

export const MODEL_VERSION_STATUSES = ['draft', 'in_review', 'approved', 'active', 'retired', 'rejected'] as const;
export const ModelVersionStatusSchema = z.enum(MODEL_VERSION_STATUSES);
export type ModelVersionStatus = z.infer<typeof ModelVersionStatusSchema>;

export const CORRECTION_MODES = ['free_run', 'reset', 'kalman'] as const;
export const CorrectionInputSchema = z.object({
  mode: z.enum(CORRECTION_MODES).default('free_run'),
  /** Process-noise covariance (n×n) and measurement-noise covariance (p×p); kalman only. */
  Q: z.unknown().optional(),
  R: z.unknown().optional(),
});

const LooseMatrix = z.unknown();
export const CreateModelVersionBodySchema = z.object({
  /** 'discrete': A, B (C, D) as given; 'continuous': Ac, Bc discretised by zero-order hold at the loop's sample period. */
  source: z.enum(['discrete', 'continuous']).default('discrete'),
  A: LooseMatrix.optional(),
  B: LooseMatrix.optional(),
  Ac: LooseMatrix.optional(),
  Bc: LooseMatrix.optional(),
  C: LooseMatrix.optional(),
  D: LooseMatrix.optional(),
  correction: CorrectionInputSchema.default({ mode: 'free_run' }),
  changeNote: z.string().trim().min(1, 'say what changed and why').max(4000),
});
export type CreateModelVersionBody = z.input<typeof CreateModelVersionBodySchema>;

export const AnalysisBodySchema = z.object({
  A: LooseMatrix,
  B: LooseMatrix,
  C: LooseMatrix.optional(),
  D: LooseMatrix.optional(),
  samplePeriodS: z.number().positive(),
  stepSamples: z.number().int().min(1).max(5000).optional(),
});

export const SubmitBodySchema = z.object({
  justification: z.string().trim().max(4000).optional(),
  /** Succeeded backtests of the loop that replayed this version, attached as evidence in the same step. */
  backtestIds: z.array(z.uuid()).max(8).optional(),
});
export const ApproveBodySchema = z.object({ note: z.string().trim().max(4000).optional() });
export const RejectBodySchema = z.object({ reason: z.string().trim().min(1, 'give the author a reason').max(4000) });
export const ActivateBodySchema = z.object({
  acknowledgeCautions: z.literal(true, 'confirm that you have read the cautions'),
});
export const RetireBodySchema = z.object({ note: z.string().trim().max(4000).optional() });

const Person = z.object({ email: z.string(), name: z.string() }).nullable();

export const ModelVersionSchema = z.object({
  id: z.uuid(),
  loopId: z.uuid(),
  number: z.number().int(),
  status: ModelVersionStatusSchema,
  A: z.array(z.array(z.number())),
  B: z.array(z.array(z.number())),
  C: z.array(z.array(z.number())).nullable(),
  D: z.array(z.array(z.number())).nullable(),
  continuous: z
    .object({ Ac: z.array(z.array(z.number())), Bc: z.array(z.array(z.number())), samplePeriodS: z.number() })
    .nullable(),
  correction: z.object({
    mode: z.enum(CORRECTION_MODES),
    Q: z.array(z.array(z.number())).nullable(),
    R: z.array(z.array(z.number())).nullable(),
    /** Steady-state Kalman gain and prior covariance (kalman only). */
    K: z.array(z.array(z.number())).nullable(),
    P: z.array(z.array(z.number())).nullable(),
  }),
  changeNote: z.string(),
  justification: z.string().nullable(),
  /** The engine's ModelAnalysis (simulator/src/engine/analysis.ts), stored at creation. */
  analysis: z.unknown(),
  author: Person,
  reviewer: Person,
  reviewNote: z.string().nullable(),
  rejectReason: z.string().nullable(),
  activatedBy: Person,
  createdAt: z.string(),
  submittedAt: z.string().nullable(),
  reviewedAt: z.string().nullable(),
  activatedAt: z.string().nullable(),
  retiredAt: z.string().nullable(),
});
export type ModelVersion = z.infer<typeof ModelVersionSchema>;
