import { ForecastQuerySchema, ForecastSchema, MovePreviewBodySchema, MovePreviewSchema } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { loopForecast, loopMovePreview } from './forecast.service.js';

export function registerForecastRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId/forecast',
      access: 'signed-in',
      tag: 'twin',
      summary:
        "The twin's predicted next n samples (default 60) from its persisted state with the newest inputs held; a model prediction, not a measurement. 409 when the loop has no twin yet",
      query: ForecastQuerySchema,
      response: ForecastSchema,
    },
    ({ req, query }) => loopForecast(db, String(req.params.loopId), query.n),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops/:loopId/move-preview',
      access: 'signed-in',
      tag: 'twin',
      summary:
        'What-if: the forecast after a step of delta in input inputIndex (engineering units), with the held-input forecast as baseline; nothing is sent to the plant. 409 when the loop has no twin yet',
      body: MovePreviewBodySchema,
      response: MovePreviewSchema,
    },
    ({ req, body }) => loopMovePreview(db, String(req.params.loopId), body),
  );
}
