import { z } from 'zod';
import { AttachEvidenceBodySchema, EvidenceSchema } from '../../contracts/backtests.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { attachEvidence, detachEvidence, listVersionEvidence } from './evidence.service.js';

const TAG = 'model versions';
const BASE = '/api/v1/model-versions/:id/evidence';

/** Backtests attached to a model version as evidence for its review. */
export function registerEvidenceRoutes(routes: RouteTable, db: Db): void {
  const id = (params: Record<string, unknown>) => String(params.id);

  routes.add(
    {
      method: 'get',
      path: BASE,
      access: 'signed-in',
      tag: TAG,
      summary:
        "Backtests attached to the version as evidence, newest first, each with its verdict and this version's (and the active version's) figures",
      response: z.array(EvidenceSchema),
    },
    ({ req }) => listVersionEvidence(db, id(req.params)),
  );

  routes.add(
    {
      method: 'post',
      path: BASE,
      access: ['engineer'],
      tag: TAG,
      status: 201,
      summary:
        'Attach a succeeded backtest of the loop that replayed this version, while the version is a draft or in review (409 otherwise); ' +
        'attaching it again changes nothing and answers 200',
      body: AttachEvidenceBodySchema,
      response: EvidenceSchema,
    },
    async ({ req, res, user, body }) => {
      const { evidence, created } = await attachEvidence(db, user, id(req.params), body);
      if (created) return evidence;
      res.status(200).json(evidence);
      return undefined;
    },
  );

  routes.add(
    {
      method: 'delete',
      path: `${BASE}/:backtestId`,
      access: ['engineer'],
      tag: TAG,
      status: 204,
      summary: 'Remove a backtest from the version’s evidence (draft or in review only)',
    },
    ({ req, user }) => detachEvidence(db, user, id(req.params), String(req.params.backtestId)),
  );
}
