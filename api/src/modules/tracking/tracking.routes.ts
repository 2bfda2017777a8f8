import { LoopTrackingSchema } from '../../contracts/twin.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { loopTracking } from './tracking.service.js';

export function registerTrackingRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId/tracking',
      access: 'signed-in',
      tag: 'twin',
      summary:
        "The loop's tracking status (stale derived), newest residual, running residual mean and standard deviation, and the residual band per output",
      response: LoopTrackingSchema,
    },
    ({ req }) => loopTracking(db, String(req.params.loopId)),
  );
}
