import {
  ActivateBodySchema,
  ApproveBodySchema,
  ModelVersionSchema,
  RejectBodySchema,
  RetireBodySchema,
  SubmitBodySchema,
} from '../../contracts/registry.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import type { TwinPublisher } from '../../realtime/publisher.js';
import { activateVersion } from './activation.service.js';
import { approveVersion, rejectVersion, retireVersion, submitVersion } from './review.service.js';

/** The review flow: draft → in_review → approved (or rejected) → active → retired. */
export function registerReviewRoutes(routes: RouteTable, db: Db, publisher?: TwinPublisher): void {
  const action = { method: 'post', access: ['engineer'], tag: 'model versions', response: ModelVersionSchema } as const;
  const id = (params: Record<string, unknown>) => String(params.id);

  routes.add(
    {
      ...action,
      path: '/api/v1/model-versions/:id/submit',
      body: SubmitBodySchema,
      summary:
        'Submit your draft for review; an unstable or marginal model needs a justification (422 otherwise); backtestIds attach succeeded backtests of the loop that include this version as evidence in the same step',
    },
    ({ user, req, body }) => submitVersion(db, user, id(req.params), body.justification, body.backtestIds),
  );

  routes.add(
    {
      ...action,
      path: '/api/v1/model-versions/:id/approve',
      body: ApproveBodySchema,
      summary: 'Approve a version in review; never your own (403, four-eyes rule)',
    },
    ({ user, req, body }) => approveVersion(db, user, id(req.params), body.note),
  );

  routes.add(
    {
      ...action,
      path: '/api/v1/model-versions/:id/reject',
      body: RejectBodySchema,
      summary: 'Reject a version in review with a reason for its author; never your own (403)',
    },
    ({ user, req, body }) => rejectVersion(db, user, id(req.params), body.reason),
  );

  routes.add(
    {
      ...action,
      path: '/api/v1/model-versions/:id/activate',
      body: ActivateBodySchema,
      summary:
        'Make an approved version the twin of its loop; the previous active version is retired; 409 when the active version changed since approval',
    },
    ({ user, req }) => activateVersion(db, user, id(req.params), publisher),
  );

  routes.add(
    {
      ...action,
      path: '/api/v1/model-versions/:id/retire',
      body: RetireBodySchema,
      summary: 'Retire an active or approved version (retiring the active one stops its twin)',
    },
    ({ user, req, body }) => retireVersion(db, user, id(req.params), body.note),
  );
}
