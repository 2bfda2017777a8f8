import type { Knex } from 'knex';
import type { Matrix } from '@shadowloop/simulator/engine';

/** How many recent residuals the direction averages. */
export const DIRECTION_WINDOW = 20;

/** The loop's active model version, as the raise needs it. */
export interface ActiveModel {
  id: string;
  number: number;
  A: Matrix;
  C: Matrix | null;
  samplePeriodS: number;
  analysis: { stability?: string; spectralRadius?: number } | null;
}

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

/** A drift rule's stored params (the evaluator validated them) and its persistence. */
export async function findRuleParams(trx: Knex.Transaction, ruleId: string): Promise<Record<string, unknown> | null> {
  const row = (await trx('drift_rules').where({ id: ruleId }).first('params')) as
    { params: Record<string, unknown> } | undefined;
  return row?.params ?? null;
}

const positiveVector = (value: unknown, length: number): number[] | null =>
  Array.isArray(value) &&
  value.length === length &&
  value.every((v) => typeof v === 'number' && v > 0 && Number.isFinite(v))
    ? (value as number[])
    : null;

/**
 * The residual scale per output: the rule's sigma where it has one, else the loop's running residual
 * standard deviation (Welford sums in loop_tracking), else 1.
 */
export async function residualSigma(
  trx: Knex.Transaction,
  loopId: string,
  params: Record<string, unknown> | null,
  outputs: number,
): Promise<number[]> {
  const fromRule = positiveVector(params?.sigma, outputs);
  if (fromRule) return fromRule;
  const row = (await trx('loop_tracking').where({ loop_id: loopId }).first('residual_count', 'residual_m2')) as
    { residual_count: string | number; residual_m2: number[] | null } | undefined;
  const count = Number(row?.residual_count ?? 0);
  const m2 = row?.residual_m2;
  return Array.from({ length: outputs }, (_, i) => {
    const sd = count > 1 && m2 && Number.isFinite(m2[i]) ? Math.sqrt(m2[i] / (count - 1)) : 0;
    return sd > 0 ? sd : 1;
  });
}

/**
 * The newest residuals up to the raise's slot, oldest first, read through the ingest transaction (so
 * the batch being stored is included). The lower bound keeps the scan to the recent day partitions.
 */
export async function residualWindow(
  trx: Knex.Transaction,
  loopId: string,
  upToMs: number,
  samplePeriodS: number,
): Promise<number[][]> {
  const earliest = new Date(upToMs - 5 * DIRECTION_WINDOW * samplePeriodS * 1000);
  const rows = (await trx('predictions')
    .where({ loop_id: loopId })
    .whereNotNull('residual')
    .where('slot_at', '<=', new Date(upToMs))
    .where('slot_at', '>=', earliest)
    .orderBy('slot_at', 'desc')
    .limit(DIRECTION_WINDOW)
    .select('residual')) as { residual: number[] }[];
  return rows.map((r) => r.residual).reverse();
}
