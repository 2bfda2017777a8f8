import { z } from 'zod';
import {
  CreatedIngestSourceSchema,
  CreateIngestSourceBodySchema,
  IngestSourceSchema,
  SetIngestSourceLoopsBodySchema,
} from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import {
  createIngestSource,
  listIngestSources,
  revokeIngestSource,
  setIngestSourceLoops,
} from './ingest-sources.service.js';

export function registerIngestSourceRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/ingest-sources',
      access: ['admin'],
      tag: 'ingest sources',
      summary: 'Plant bridges allowed to post readings, with the loops each may post for',
      response: z.array(IngestSourceSchema),
    },
    () => listIngestSources(db),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/ingest-sources',
      access: ['admin'],
      tag: 'ingest sources',
      status: 201,
      summary:
        'Create an ingest source scoped to some loops; its token (sli_…) is shown once and may only post readings for those loops',
      body: CreateIngestSourceBodySchema,
      response: CreatedIngestSourceSchema,
    },
    ({ user, body }) => createIngestSource(db, user, body),
  );

  routes.add(
    {
      method: 'put',
      path: '/api/v1/ingest-sources/:id/loops',
      access: ['admin'],
      tag: 'ingest sources',
      summary: 'Replace the loops an ingest source may post readings for',
      body: SetIngestSourceLoopsBodySchema,
      response: IngestSourceSchema,
    },
    ({ user, req, body }) => setIngestSourceLoops(db, user, String(req.params.id), body.loopIds),
  );

  routes.add(
    {
      method: 'delete',
      path: '/api/v1/ingest-sources/:id',
      access: ['admin'],
      tag: 'ingest sources',
      summary: "Revoke an ingest source's token (its readings stay)",
    },
    async ({ user, req }) => {
      await revokeIngestSource(db, user, String(req.params.id));
    },
  );
}
