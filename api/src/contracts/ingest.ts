import { z } from 'zod';

/**
 * Readings from the plant: the live ingest route, historical CSV imports and the ingest sources
 * (plant bridges) whose tokens may post them.
 */
export const INGEST_LIMITS = {
  /** Readings in one POST …/readings batch. */
  maxBatch: 5000,
  /** Bad rows an import reports with their line (the count covers all of them). */
  reportedBadRows: 100,
  /** Rows a preview shows after the header. */
  previewRows: 20,
} as const;

/**
 * Only the envelope is checked here: each reading is checked by itself against the loop's signal
 * counts, so that one bad reading is reported with its index while the good ones are kept.
 */
export const ReadingsBodySchema = z.object({
  readings: z
    .array(z.unknown())
    .min(1)
    .max(INGEST_LIMITS.maxBatch, `send at most ${INGEST_LIMITS.maxBatch} readings per request`),
});
export type ReadingsBody = { readings: { t: string; u: number[]; y: number[] }[] };

export const RejectedReadingSchema = z.object({ index: z.number().int(), reason: z.string() });
export const IngestResultSchema = z.object({
  accepted: z.number().int(),
  duplicates: z.number().int(),
  rejected: z.array(RejectedReadingSchema),
});
export type IngestResult = z.infer<typeof IngestResultSchema>;

/** A CSV column by its header name or its zero-based position. */
const ColumnRef = z.union([z.string().min(1), z.number().int().min(0)]);
export const ImportMappingSchema = z.object({ t: ColumnRef, u: z.array(ColumnRef), y: z.array(ColumnRef) });
export type ImportMapping = z.infer<typeof ImportMappingSchema>;

/** A multipart text field holding JSON, parsed and then checked against `schema`. */
export function jsonField<T extends z.ZodType>(schema: T, notJson: string) {
  return z
    .string()
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: 'custom', message: notJson });
        return z.NEVER;
      }
    })
    .pipe(schema);
}

/** The column mapping as a multipart field (imports and uploaded backtests). */
export const MappingFieldSchema = jsonField(
  ImportMappingSchema,
  'mapping is not JSON, e.g. {"t":"time","u":["valve"],"y":["level"]}',
);

/** The text fields of the multipart import request; send them before the file part. */
export const ImportFieldsSchema = z.object({
  mapping: MappingFieldSchema,
  importId: z.uuid().optional(),
});

export const BadRowSchema = z.object({ line: z.number().int(), reason: z.string() });
export const ImportProgressSchema = z.object({
  id: z.uuid(),
  loopId: z.uuid(),
  fileName: z.string(),
  rowsRead: z.number().int(),
  accepted: z.number().int(),
  duplicates: z.number().int(),
  rejected: z.number().int(),
  /** The first bad rows (line 1 is the header), at most INGEST_LIMITS.reportedBadRows. */
  badRows: z.array(BadRowSchema),
  done: z.boolean(),
  error: z.string().nullable(),
  startedAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type ImportProgress = z.infer<typeof ImportProgressSchema>;

export const ImportPreviewSchema = z.object({
  header: z.array(z.string()),
  rows: z.array(z.array(z.string())),
  /** Columns whose header matches a signal name (t: a column named like a time), when all were found. */
  suggestedMapping: ImportMappingSchema.nullable(),
});
export type ImportPreview = z.infer<typeof ImportPreviewSchema>;

export const IngestSourceSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  description: z.string(),
  prefix: z.string(),
  loops: z.array(z.object({ id: z.uuid(), tag: z.string() })),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type IngestSource = z.infer<typeof IngestSourceSchema>;
export const CreatedIngestSourceSchema = IngestSourceSchema.extend({ token: z.string() });

const LoopIds = z
  .array(z.uuid())
  .max(5000)
  .refine((ids) => new Set(ids).size === ids.length, 'loopIds must not repeat');
export const CreateIngestSourceBodySchema = z.object({
  name: z.string().trim().min(1).max(80),
  description: z.string().trim().max(500).default(''),
  loopIds: LoopIds,
});
export const SetIngestSourceLoopsBodySchema = z.object({ loopIds: LoopIds });
