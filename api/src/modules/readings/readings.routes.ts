import { IngestResultSchema, INGEST_LIMITS, ReadingsBodySchema } from '../../contracts/ingest.js';
import type { RouteTable } from '../../http/route.js';
import { ingestRateLimit } from './ingest-limit.js';
import { ingestReadings, type IngestDeps } from './ingest.service.js';

export function registerReadingRoutes(routes: RouteTable, deps: IngestDeps & { ratePerMinute: number }): void {
  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/readings',
      access: ['engineer'],
      ingest: true,
      tag: 'readings',
      use: [ingestRateLimit(deps.ratePerMinute)],
      summary:
        `Post up to ${INGEST_LIMITS.maxBatch} readings {t, u, y} (an ingest token scoped to the loop, or an engineer). ` +
        'Each goes to its sample slot k = round(t/T); a slot already filled counts as a duplicate; bad readings are rejected with their index and reason while the good ones are kept',
      body: ReadingsBodySchema,
      response: IngestResultSchema,
    },
    ({ req, body, ingest }) => ingestReadings(deps, String(req.params.loopId), body.readings, ingest),
  );
}
