import { z } from 'zod';
import {
  DriftRuleSchema,
  DriftRuleSuggestionSchema,
  DriftRuleVersionSchema,
  PreviewDriftRuleBodySchema,
  RuleExpectationSchema,
  SaveDriftRuleBodySchema,
} from '../../contracts/alerts.js';
import type { RouteTable } from '../../http/route.js';
import type { AlertRouteDeps } from '../alert.routes.js';
import { listDriftRules, listDriftRuleVersions, previewDriftRule, saveDriftRule } from './drift-rules.service.js';
import { suggestSigma } from './sigma-suggestion.js';

const TAG = 'drift rules';
const BASE = '/api/v1/loops/:loopId/drift-rules';

export function registerDriftRuleRoutes(routes: RouteTable, deps: AlertRouteDeps): void {
  const { db } = deps;
  const loopId = (params: Record<string, unknown>) => String(params.loopId);

  routes.add(
    {
      method: 'get',
      path: BASE,
      access: 'signed-in',
      tag: TAG,
      summary: "The loop's drift rules, each with its expected false-alert interval at the loop's sample period",
      response: z.array(DriftRuleSchema),
    },
    ({ req }) => listDriftRules(db, loopId(req.params)),
  );

  routes.add(
    {
      method: 'get',
      path: `${BASE}/suggest`,
      access: ['engineer'],
      tag: TAG,
      summary: "Suggested sigma per output from the loop's running residual statistics, for the rule editor",
      response: DriftRuleSuggestionSchema,
    },
    ({ req }) => suggestSigma(db, loopId(req.params)),
  );

  routes.add(
    {
      method: 'post',
      path: `${BASE}/preview`,
      access: ['engineer'],
      tag: TAG,
      summary: 'The expected false-alert interval (and CUSUM detection delay) of unsaved rule settings',
      body: PreviewDriftRuleBodySchema,
      response: RuleExpectationSchema,
    },
    ({ req, body }) => previewDriftRule(db, loopId(req.params), body),
  );

  routes.add(
    {
      method: 'put',
      path: `${BASE}/:kind`,
      access: ['engineer'],
      tag: TAG,
      summary: 'Create or replace the loop’s rule of this kind (band, cusum, nis, stale) as a new, audited version',
      body: SaveDriftRuleBodySchema,
      response: DriftRuleSchema,
    },
    ({ req, user, body }) => saveDriftRule(db, user, loopId(req.params), String(req.params.kind), body),
  );

  routes.add(
    {
      method: 'get',
      path: `${BASE}/:kind/versions`,
      access: 'signed-in',
      tag: TAG,
      summary: 'Every saved version of the loop’s rule of this kind, newest first',
      response: z.array(DriftRuleVersionSchema),
    },
    ({ req }) => listDriftRuleVersions(db, loopId(req.params), String(req.params.kind)),
  );
}
