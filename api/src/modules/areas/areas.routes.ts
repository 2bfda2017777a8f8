import { z } from 'zod';
import { AreaSchema } from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { listAreas } from './areas.repository.js';

export function registerAreaRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/areas',
      access: 'signed-in',
      tag: 'loops',
      summary: "The plant's areas in display order",
      response: z.array(AreaSchema),
    },
    () => listAreas(db),
  );
}
