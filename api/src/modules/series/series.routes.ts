import { SeriesQuerySchema, SeriesSchema } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { loopSeries } from './series.service.js';

export function registerSeriesRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId/series',
      access: 'signed-in',
      tag: 'readings',
      summary:
        'Measured, predicted, residual (one array per output) and inputs (one per input), aligned with t; from defaults to 15 min before to (default now); ' +
        'more samples than maxPoints come back as min and max per time bucket',
      query: SeriesQuerySchema,
      response: SeriesSchema,
    },
    ({ req, query }) => loopSeries(db, String(req.params.loopId), query),
  );
}
