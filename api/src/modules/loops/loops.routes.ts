import { z } from 'zod';
import {
  CreateLoopBodySchema,
  LoopListQuerySchema,
  LoopSchema,
  UpdateLoopBodySchema,
} from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { createLoop, getLoop, listLoops, updateLoop } from './loops.service.js';

export function registerLoopRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops',
      access: 'signed-in',
      tag: 'loops',
      summary: 'Every loop with its tracking status, active version and versions waiting; filter by area or status',
      query: LoopListQuerySchema,
      response: z.array(LoopSchema),
    },
    ({ query }) => listLoops(db, query),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId',
      access: 'signed-in',
      tag: 'loops',
      summary: 'One loop with its signals and operating point',
      response: LoopSchema,
    },
    ({ req }) => getLoop(db, String(req.params.loopId)),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/loops',
      access: ['engineer'],
      tag: 'loops',
      status: 201,
      summary: 'Register a loop (409 when the tag is taken; the operating point needs one value per signal)',
      body: CreateLoopBodySchema,
      response: LoopSchema,
    },
    ({ user, body }) => createLoop(db, user, body),
  );

  routes.add(
    {
      method: 'patch',
      path: '/api/v1/loops/:loopId',
      access: ['engineer'],
      tag: 'loops',
      summary: 'Change a loop; signal counts and sample period are locked (409) once it has model versions',
      body: UpdateLoopBodySchema,
      response: LoopSchema,
    },
    ({ user, req, body }) => updateLoop(db, user, String(req.params.loopId), body),
  );
}
