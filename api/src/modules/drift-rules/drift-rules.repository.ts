import type { Knex } from 'knex';
import type { DriftRuleKind, Priority } from '../../contracts/alerts.js';
import type { Db } from '../../db/knex.js';

/** A drift_rules row in API names; params as stored (validated on the way in). */
export interface DriftRuleRow {
  id: string;
  loopId: string;
  kind: DriftRuleKind;
  enabled: boolean;
  priority: Priority;
  params: Record<string, unknown>;
  version: number;
  updatedAt: string;
  updatedBy: string | null;
}

type Raw = {
  id: string;
  loop_id: string;
  kind: DriftRuleKind;
  enabled: boolean;
  priority: number;
  params: Record<string, unknown>;
  version: number;
  updated_at: Date;
  updated_by_name?: string | null;
};

const toRule = (r: Raw): DriftRuleRow => ({
  id: r.id,
  loopId: r.loop_id,
  kind: r.kind,
  enabled: r.enabled,
  priority: r.priority as Priority,
  params: r.params,
  version: r.version,
  updatedAt: r.updated_at.toISOString(),
  updatedBy: r.updated_by_name ?? null,
});

const KIND_ORDER = `array_position(ARRAY['band','cusum','nis','stale']::text[], r.kind)`;

export async function listRuleRows(db: Db, loopId: string): Promise<DriftRuleRow[]> {
  const rows = (await db('drift_rules as r')
    .leftJoin('users as u', 'u.id', 'r.updated_by')
    .where('r.loop_id', loopId)
    .select('r.*', 'u.name as updated_by_name')
    .orderByRaw(KIND_ORDER)) as Raw[];
  return rows.map(toRule);
}

/** The rule of this kind, locked until the transaction ends (saves of one rule queue here). */
export async function lockRule(
  trx: Knex.Transaction,
  loopId: string,
  kind: DriftRuleKind,
): Promise<DriftRuleRow | undefined> {
  const row = (await trx('drift_rules').where({ loop_id: loopId, kind }).forUpdate().first()) as Raw | undefined;
  return row && toRule(row);
}

export interface RuleContent {
  enabled: boolean;
  priority: Priority;
  params: Record<string, unknown>;
}

/** Inserts version 1 of a rule unless another transaction just did; undefined then. */
export async function insertRule(
  trx: Db,
  row: RuleContent & { loopId: string; kind: DriftRuleKind; userId: string | null },
): Promise<DriftRuleRow | undefined> {
  const [inserted] = (await trx('drift_rules')
    .insert({
      loop_id: row.loopId,
      kind: row.kind,
      enabled: row.enabled,
      priority: row.priority,
      params: JSON.stringify(row.params),
      version: 1,
      updated_by: row.userId,
    })
    .onConflict(['loop_id', 'kind'])
    .ignore()
    .returning('*')) as Raw[];
  return inserted && toRule(inserted);
}

export async function updateRule(trx: Db, id: string, content: RuleContent & { version: number; userId: string }) {
  await trx('drift_rules')
    .where({ id })
    .update({
      enabled: content.enabled,
      priority: content.priority,
      params: JSON.stringify(content.params),
      version: content.version,
      updated_by: content.userId,
      updated_at: trx.fn.now(),
    });
}

export async function insertRuleVersion(
  trx: Db,
  row: RuleContent & { ruleId: string; version: number; note: string; userId: string | null },
): Promise<void> {
  await trx('drift_rule_versions').insert({
    rule_id: row.ruleId,
    version: row.version,
    enabled: row.enabled,
    priority: row.priority,
    params: JSON.stringify(row.params),
    note: row.note,
    changed_by: row.userId,
  });
}

type VersionRaw = {
  version: number;
  enabled: boolean;
  priority: number;
  params: Record<string, unknown>;
  note: string;
  changed_at: Date;
  changed_by_name: string | null;
};

/** Every saved form of the loop's rule of this kind, newest first (empty when it has none). */
export async function listRuleVersions(db: Db, loopId: string, kind: DriftRuleKind) {
  const rows = (await db('drift_rule_versions as v')
    .join('drift_rules as r', 'r.id', 'v.rule_id')
    .leftJoin('users as u', 'u.id', 'v.changed_by')
    .where({ 'r.loop_id': loopId, 'r.kind': kind })
    .select('v.*', 'u.name as changed_by_name')
    .orderBy('v.version', 'desc')) as VersionRaw[];
  return rows.map((r) => ({
    version: r.version,
    enabled: r.enabled,
    priority: r.priority as Priority,
    params: r.params,
    note: r.note,
    changedAt: r.changed_at.toISOString(),
    changedBy: r.changed_by_name,
  }));
}
