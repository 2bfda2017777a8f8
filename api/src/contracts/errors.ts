import { z } from 'zod';

/** The one error shape of every API response (DESIGN.md §6). */
export const ErrorBodySchema = z.object({
  error: z.object({ code: z.string(), message: z.string(), details: z.unknown().optional() }),
});
export type ErrorBody = z.infer<typeof ErrorBodySchema>;
