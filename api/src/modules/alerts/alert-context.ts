import type { Knex } from 'knex';
import type { Matrix } from '@shadowloop/simulator/engine';
import type { RuleModel } from '../drift-rules/rule-runtime.js';
import type { ResidualStatistics } from '../tracking/residual-statistics.js';

/** How many recent residuals the direction averages. */
export const DIRECTION_WINDOW = 20;

/** The loop's active model version, as the raise needs it (the ingest has it with the rule set). */
export type ActiveModel = RuleModel;

type VersionRaw = {
  id: string;
  number: number;
  a: Matrix;
  c: Matrix | null;
  sample_period_s: number;
  analysis: ActiveModel['analysis'];
};

export async function findModel(trx: Knex.Transaction, where: { loopId: string } | { versionId: string }) {
  const query = trx('model_versions').first('id', 'number', 'a', 'c', 'sample_period_s', 'analysis');
  if ('versionId' in where) query.where({ id: where.versionId });
  else query.where({ loop_id: where.loopId, status: 'active' });
  const row = (await query) as VersionRaw | undefined;
  if (!row) return null;
  const model: ActiveModel = {
    id: row.id,
    number: row.number,
    A: row.a,
    C: row.c,
    samplePeriodS: row.sample_period_s,
    analysis: row.analysis,
  };
  return model;
}

const positiveVector = (value: unknown, length: number): number[] | null =>
  Array.isArray(value) &&
  value.length === length &&
  value.every((v) => typeof v === 'number' && v > 0 && Number.isFinite(v))
    ? (value as number[])
    : null;

/**
 * The residual scale per output: the rule's sigma where it has one, else the loop's running residual
 * standard deviation (the Welford sums of loop_tracking as the ingest locked them), else 1.
 */
export function residualSigma(
  params: Record<string, unknown> | null,
  stats: Pick<ResidualStatistics, 'count' | 'm2'>,
  outputs: number,
): number[] {
  const fromRule = positiveVector(params?.sigma, outputs);
  if (fromRule) return fromRule;
  const { count, m2 } = stats;
  return Array.from({ length: outputs }, (_, i) => {
    const sd = count > 1 && m2 && Number.isFinite(m2[i]) ? Math.sqrt(m2[i] / (count - 1)) : 0;
    return sd > 0 ? sd : 1;
  });
}

/**
 * Where a raise's direction looks: the newest residuals up to the raise's slot, read through the
 * ingest transaction (so the batch being stored is included) with the open-alert check
 * (alert-raise.ts). The lower bound keeps the scan to the recent day partitions.
 */
export interface ResidualWindow {
  upToMs: number;
  samplePeriodS: number;
}

/** SQL (one column, a JSON array of residuals oldest first) and its bindings for a window. */
export function residualWindowSql(trx: Knex.Transaction, loopId: string, window: ResidualWindow) {
  const earliest = new Date(window.upToMs - 5 * DIRECTION_WINDOW * window.samplePeriodS * 1000);
  return trx.raw(
    `SELECT json_agg(w.residual ORDER BY w.slot_at) FROM (
      SELECT slot_at, residual FROM predictions
      WHERE loop_id = ? AND residual IS NOT NULL AND slot_at <= ? AND slot_at >= ?
      ORDER BY slot_at DESC LIMIT ?) w`,
    [loopId, new Date(window.upToMs), earliest, DIRECTION_WINDOW],
  );
}

/**
 * The raise context read through the transaction, for a caller that does not hold it (the ingest
 * does): the active model, the rules' stored params and the loop's residual statistics.
 */
export async function readRaiseContext(trx: Knex.Transaction, loopId: string, ruleIds: string[]) {
  const model = await findModel(trx, { loopId });
  const rules = (await trx('drift_rules').whereIn('id', ruleIds).select('id', 'params')) as {
    id: string;
    params: Record<string, unknown>;
  }[];
  const row = (await trx('loop_tracking').where({ loop_id: loopId }).first('residual_count', 'residual_m2')) as
    { residual_count: string | number; residual_m2: number[] | null } | undefined;
  return {
    model,
    params: new Map(rules.map((r) => [r.id, r.params])),
    stats: { count: Number(row?.residual_count ?? 0), m2: row?.residual_m2 ?? [] },
  };
}
