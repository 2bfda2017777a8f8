import type { SignedInUser } from '../../auth/user.js';
import { announceCacheChange } from '../../lib/cache-notice.js';
import type { AlertDetail, AlertRuleKind, AlertSuppression, LoopMaintenance } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';
import { notFound } from '../../http/errors.js';
import { isUuid } from '../../http/params.js';
import { recordAudit } from '../audit/audit.repository.js';
import { lockLoop } from '../loops/loops.repository.js';
import { forgetLiveLoop } from '../readings/live-loop.js';

/**
 * Puts a loop into maintenance or takes it out: while in maintenance its rules' raises are recorded
 * (alert_suppressions) and nobody is called. Alerts already open stay as they are.
 */
export async function setLoopMaintenance(
  db: Db,
  actor: SignedInUser,
  loopId: string,
  body: { maintenance: boolean; note: string },
): Promise<LoopMaintenance> {
  if (!isUuid(loopId)) throw notFound(`Loop ${loopId}`);
  const result = await db.transaction(async (trx) => {
    const loop = await lockLoop(trx, loopId);
    if (!loop) throw notFound(`Loop ${loopId}`);
    const before = (await trx('loops').where({ id: loopId }).first('maintenance')) as { maintenance: boolean };
    if (before.maintenance !== body.maintenance) {
      await trx('loops').where({ id: loopId }).update({ maintenance: body.maintenance, updated_at: trx.fn.now() });
      // back in service: the rules start afresh, so a condition still present raises (and calls) again
      if (!body.maintenance) await trx('loop_tracking').where({ loop_id: loopId }).update({ rule_state: {} });
      await announceCacheChange(trx, { loopId });
      await recordAudit(trx, {
        actor,
        action: body.maintenance ? 'loop.maintenance_started' : 'loop.maintenance_ended',
        targetType: 'loop',
        targetId: loopId,
        details: { loopId, loopTag: loop.tag, note: body.note },
      });
    }
    return { loopId, loopTag: loop.tag, maintenance: body.maintenance };
  });
  forgetLiveLoop(loopId);
  return result;
}

type SuppressionRaw = {
  id: string | number;
  loop_id: string;
  rule_kind: AlertRuleKind;
  at: Date;
  summary: string;
  detail: AlertDetail;
};

/** The loop's most recent suppressed raises, newest first. */
export async function listSuppressions(db: Db, loopId: string, limit: number): Promise<AlertSuppression[]> {
  if (!isUuid(loopId) || !(await db('loops').where({ id: loopId }).first('id'))) throw notFound(`Loop ${loopId}`);
  const rows = (await db('alert_suppressions')
    .where({ loop_id: loopId })
    .orderBy([
      { column: 'at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .limit(limit)) as SuppressionRaw[];
  return rows.map((r) => ({
    id: Number(r.id),
    loopId: r.loop_id,
    rule: r.rule_kind,
    at: r.at.toISOString(),
    summary: r.summary,
    detail: r.detail,
  }));
}
