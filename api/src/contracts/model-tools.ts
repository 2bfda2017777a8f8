import { z } from 'zod';

/**
 * What the engineer's model tools answer: the analysis object (API.md), the state transition
 * explorer, uploads read for the editor, and the problem lists of rejected models.
 */
const MatrixSchema = z.array(z.array(z.number()));
export const ComplexSchema = z.object({ re: z.number(), im: z.number() });

export const ModeSchema = z.object({
  eigenvalue: ComplexSchema,
  magnitude: z.number(),
  timeConstantS: z.number().nullable(),
  naturalFrequencyRadS: z.number().nullable(),
  dampingRatio: z.number().nullable(),
  periodSamples: z.number().nullable(),
});

/** The engine's ModelAnalysis (simulator/src/engine/analysis.ts); modes sorted slowest first. */
export const ModelAnalysisSchema = z.object({
  spectralRadius: z.number(),
  stability: z.enum(['stable', 'marginal', 'unstable']),
  defective: z.boolean(),
  eigenvectorCondition: z.number(),
  modes: z.array(ModeSchema),
  /** (I − A)^{-1} B, or null when I − A is singular (an integrating mode). */
  steadyStateGain: MatrixSchema.nullable(),
  controllabilityRank: z.number().int(),
  observabilityRank: z.number().int(),
  /** series[output][input][n] after a unit step in the input, at t[n] = n·T seconds. */
  stepResponse: z.object({
    samples: z.number().int(),
    t: z.array(z.number()),
    series: z.array(z.array(z.array(z.number()))),
  }),
});
export type ModelAnalysis = z.infer<typeof ModelAnalysisSchema>;

/** One problem of a rejected model: field is the zero-based path (A.1.0), the message counts from 1. */
export const ModelProblemSchema = z.object({ field: z.string(), message: z.string() });
export type ModelProblem = z.infer<typeof ModelProblemSchema>;

/** Without stepSamples the horizon is 200 samples, shortened for very wide models (the chart's size is bounded). */
export const AnalysisQuerySchema = z.object({ stepSamples: z.coerce.number().int().min(1).max(5000).optional() });
export const ExportQuerySchema = z.object({ format: z.enum(['json', 'csv']).default('json') });

export const ExploreBodySchema = z.object({
  k: z.number().int().min(0).max(100_000),
  /** Initial state deviation from the operating point, one entry per state. */
  x0: z.array(z.number()).min(1).max(200),
  steps: z.number().int().min(1).max(2000),
});
export type ExploreBody = z.infer<typeof ExploreBodySchema>;

export const ModalContributionSchema = z.object({
  eigenvalue: ComplexSchema,
  conjugatePair: z.boolean(),
  eigenvector: z.array(ComplexSchema),
  coefficient: ComplexSchema,
  /** contribution[k][i]: this mode's share of state i at sample k. */
  contribution: MatrixSchema,
});

export const ExploreResultSchema = z.object({
  k: z.number().int(),
  Ak: MatrixSchema,
  /** x(0 … steps) = A^j x0, one row per sample. */
  trajectory: MatrixSchema,
  modal: z.array(ModalContributionSchema).nullable(),
  /** Why there is no mode split (a defective A has no eigenvector basis); null when modal is given. */
  modalError: z.string().nullable(),
});
export type ExploreResult = z.infer<typeof ExploreResultSchema>;

export const UPLOAD_LIMITS = { maxFileBytes: 1024 * 1024, maxFiles: 6 } as const;

/** Matrices read from an upload, for the editor to show; nothing is stored. */
export const UploadedModelSchema = z.object({
  source: z.enum(['discrete', 'continuous']),
  A: MatrixSchema.optional(),
  B: MatrixSchema.optional(),
  C: MatrixSchema.optional(),
  D: MatrixSchema.optional(),
  Ac: MatrixSchema.optional(),
  Bc: MatrixSchema.optional(),
});
export type UploadedModel = z.infer<typeof UploadedModelSchema>;

/** One problem of an upload; row and column count from 1 and are null for a whole file. */
export const UploadProblemSchema = z.object({
  file: z.string().nullable(),
  row: z.number().int().nullable(),
  column: z.number().int().nullable(),
  message: z.string(),
});
export type UploadProblem = z.infer<typeof UploadProblemSchema>;
