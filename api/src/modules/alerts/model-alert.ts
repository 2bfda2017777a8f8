import type { Knex } from 'knex';
import type { Signal } from '../../contracts/registry.js';
import { findModel } from './alert-context.js';
import { clearAlert, raiseAlert } from './alert-raise.js';
import { unstableModelSentence } from './alert-summary.js';
import type { AlertChange } from './alerts.service.js';

type LoopRaw = { id: string; tag: string; area_id: string; maintenance: boolean; outputs: Signal[] };

/**
 * The model warning, run in the activation transaction: an active version whose stored analysis is
 * `unstable` raises the loop's `model` alert (priority 1); a version that is not unstable clears it.
 * An open warning about an earlier version clears first, so the new version raises it again with
 * its own numbers. Returns the change to publish after commit.
 */
export async function checkActiveModel(
  trx: Knex.Transaction,
  loopId: string,
  versionId: string,
  now = new Date(),
): Promise<AlertChange[]> {
  const version = await findModel(trx, { versionId });
  const loop = (await trx('loops').where({ id: loopId }).first('id', 'tag', 'area_id', 'maintenance', 'outputs')) as
    LoopRaw | undefined;
  if (!version || !loop) return [];
  const details = { versionId, versionNumber: version.number };
  const open = await trx('alerts')
    .where({ loop_id: loopId, rule_kind: 'model' })
    .whereNot('state', 'closed')
    .first('version_id');
  const changes: (AlertChange | null)[] = [];
  if (version.analysis?.stability !== 'unstable' || (open && open.version_id !== versionId)) {
    changes.push(await clearAlert(trx, loopId, 'model', now, details));
  }
  if (version.analysis?.stability === 'unstable') {
    const spectralRadius = Number(version.analysis.spectralRadius);
    changes.push(
      await raiseAlert(
        trx,
        {
          loopId,
          area: loop.area_id,
          maintenance: loop.maintenance,
          ruleKind: 'model',
          ruleId: null,
          ruleVersion: null,
          priority: 1,
          versionId,
          summary: unstableModelSentence(version.number, spectralRadius),
          detail: { statistic: 'spectral radius', value: spectralRadius, limit: 1 },
          residualWindow: null,
          direction: () => null,
        },
        now,
      ),
    );
  }
  const merged = new Map<string, AlertChange['type']>();
  for (const c of changes) if (c && merged.get(c.alertId) !== 'raised') merged.set(c.alertId, c.type);
  return [...merged].map(([alertId, type]) => ({ alertId, type }));
}
