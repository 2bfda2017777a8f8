import type { Knex } from 'knex';
import { announceCacheChange } from '../../lib/cache-notice.js';
import type { z } from 'zod';
import type { SignedInUser } from '../../auth/user.js';
import type {
  DriftRule,
  DriftRuleKind,
  DriftRuleParams,
  PreviewDriftRuleBodySchema,
  RuleExpectation,
  SaveDriftRuleBodySchema,
  StaleParams,
} from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { badRequest, notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { forgetLiveLoop } from '../readings/live-loop.js';
import {
  insertRule,
  insertRuleVersion,
  listRuleRows,
  listRuleVersions,
  lockRule,
  updateRule,
  type DriftRuleRow,
} from './drift-rules.repository.js';
import { findRuleLoop, type RuleLoop } from './rule-loop.repository.js';
import { expectationOf } from './rule-expectation.js';
import { parseRuleParams, requireKind, ruleParamsProblems } from './rule-params.js';
import { forgetRuleSet } from './rule-set.js';

export async function requireRuleLoop(db: Db, loopId: string): Promise<RuleLoop> {
  const loop = isUuid(loopId) ? await findRuleLoop(db, loopId) : undefined;
  if (!loop) throw notFound(`Loop ${loopId}`);
  return loop;
}

function expectationOfStored(row: DriftRuleRow, loop: RuleLoop): RuleExpectation {
  const { params, problems } = ruleParamsProblems(row.kind, row.params, loop.outputs.length);
  if (params) return expectationOf(row.kind, params, loop.samplePeriodS, loop.outputs.length);
  return {
    falseAlertIntervalSamples: null,
    falseAlertIntervalHours: null,
    detectionDelaySamples: null,
    shiftSigma: null,
    sentence: `This rule is not evaluated until its settings are fixed: ${problems.map((p) => p.message).join('; ')}.`,
  };
}

const withExpectation = (row: DriftRuleRow, loop: RuleLoop): DriftRule => ({
  ...row,
  expectation: expectationOfStored(row, loop),
});

export async function listDriftRules(db: Db, loopId: string): Promise<DriftRule[]> {
  const loop = await requireRuleLoop(db, loopId);
  return (await listRuleRows(db, loop.id)).map((row) => withExpectation(row, loop));
}

export async function listDriftRuleVersions(db: Db, loopId: string, kind: string) {
  const loop = await requireRuleLoop(db, loopId);
  return listRuleVersions(db, loop.id, requireKind(kind));
}

/** An enabled NIS rule needs S: the active version's Kalman correction, or sigma per output. */
function assertRunnable(kind: DriftRuleKind, enabled: boolean, params: DriftRuleParams, loop: RuleLoop): void {
  if (kind !== 'nis' || !enabled || 'sigma' in params) return;
  if (loop.correctionMode === 'kalman') return;
  const message =
    'params.sigma is needed: the loop’s active version has no Kalman correction, so the NIS needs the residual standard deviation of each output';
  throw badRequest(`The nis rule's settings are not valid: ${message}.`, [{ path: 'body.params.sigma', message }]);
}

type Content = { enabled: boolean; priority: DriftRule['priority']; params: Record<string, unknown> };

/**
 * Locks the rule and writes the new content: version 1 when the loop has none of this kind, else
 * the next version. Two first saves at once: the second one's insert waits for the first and then
 * finds its row, so it becomes version 2.
 */
async function writeRule(trx: Knex.Transaction, loop: RuleLoop, kind: DriftRuleKind, content: Content, userId: string) {
  let before = await lockRule(trx, loop.id, kind);
  if (!before) {
    const created = await insertRule(trx, { ...content, loopId: loop.id, kind, userId });
    if (created) return { before: undefined, ruleId: created.id, version: 1 };
    before = await lockRule(trx, loop.id, kind);
    if (!before) throw new Error(`the ${kind} rule of loop ${loop.tag} was neither inserted nor found`);
  }
  const version = before.version + 1;
  await updateRule(trx, before.id, { ...content, version, userId });
  return { before, ruleId: before.id, version };
}

type SaveBody = z.infer<typeof SaveDriftRuleBodySchema>;

/** Creates or replaces the loop's rule of this kind as a new version, audited, in one transaction. */
export async function saveDriftRule(
  db: Db,
  actor: SignedInUser,
  loopId: string,
  kindParam: string,
  body: SaveBody,
): Promise<DriftRule> {
  const kind = requireKind(kindParam);
  const loop = await requireRuleLoop(db, loopId);
  const params = parseRuleParams(kind, body.params, loop.outputs.length);
  assertRunnable(kind, body.enabled, params, loop);
  const content = { enabled: body.enabled, priority: body.priority, params: params as Record<string, unknown> };
  await db.transaction(async (trx) => {
    const { before, ruleId, version } = await writeRule(trx, loop, kind, content, actor.id);
    await insertRuleVersion(trx, { ...content, ruleId, version, note: body.note, userId: actor.id });
    await announceCacheChange(trx, { loopId: loop.id });
    // one meaning of "stale" per loop: the tracking status turns stale when the rule would raise
    if (kind === 'stale' && body.enabled) {
      await trx('loops')
        .where({ id: loop.id })
        .update({ stale_after_samples: (params as StaleParams).afterSamples, updated_at: trx.fn.now() });
    }
    await recordAudit(trx, {
      actor,
      action: 'drift_rule.saved',
      targetType: 'drift_rule',
      targetId: ruleId,
      details: {
        loopId: loop.id,
        loopTag: loop.tag,
        kind,
        version,
        note: body.note,
        before: before ? { enabled: before.enabled, priority: before.priority, params: before.params } : null,
        after: content,
      },
    });
  });
  forgetRuleSet(loop.id);
  if (kind === 'stale') forgetLiveLoop(loop.id);
  return (await listDriftRules(db, loop.id)).find((rule) => rule.kind === kind) as DriftRule;
}

export async function previewDriftRule(
  db: Db,
  loopId: string,
  body: z.infer<typeof PreviewDriftRuleBodySchema>,
): Promise<RuleExpectation> {
  const loop = await requireRuleLoop(db, loopId);
  const params = parseRuleParams(body.kind, body.params, loop.outputs.length);
  return expectationOf(body.kind, params, loop.samplePeriodS, loop.outputs.length);
}
