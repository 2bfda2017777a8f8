import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../../http/errors.js';

/**
 * A generous per-sender limit on readings requests (per ingest source, else per user, else per
 * address): it stops a runaway bridge, not normal traffic. In memory, per api process.
 */
export function ingestRateLimit(perMinute: number) {
  return rateLimit({
    windowMs: 60_000,
    limit: perMinute,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) =>
      req.ingest ? `source:${req.ingest.sourceId}` : req.user ? `user:${req.user.id}` : ipKeyGenerator(req.ip ?? ''),
    handler: (_req, _res, next) =>
      next(
        new AppError(
          429,
          'rate_limited',
          `More than ${perMinute} readings requests in a minute from this sender; send larger batches (up to 5,000 readings) less often.`,
        ),
      ),
  });
}
