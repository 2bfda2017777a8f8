import type { Knex } from 'knex';
import type { Db } from '../../db/knex.js';

export interface AuditRecord {
  actor: { id: string; email: string } | null;
  action: string;
  targetType?: string;
  targetId?: string;
  details?: Record<string, unknown>;
}

/** Writes one audit entry; call it inside the transaction of the change it records. */
export async function recordAudit(db: Db, entry: AuditRecord): Promise<void> {
  await db('audit_log').insert({
    actor_user_id: entry.actor?.id ?? null,
    actor_email: entry.actor?.email ?? null,
    action: entry.action,
    target_type: entry.targetType ?? null,
    target_id: entry.targetId ?? null,
    details: JSON.stringify(entry.details ?? {}),
  });
}

type Raw = {
  id: string;
  at: Date;
  actor_email: string | null;
  action: string;
  target_type: string | null;
  target_id: string | null;
  details: unknown;
};

export interface AuditFilter {
  limit: number;
  offset: number;
  action?: string;
  targetType?: string;
  targetId?: string;
}

function applyFilter(q: Knex.QueryBuilder, filter: AuditFilter): void {
  if (filter.action) q.where('action', filter.action);
  if (filter.targetType === 'loop' && filter.targetId) {
    const loopId = filter.targetId;
    q.where((w) => w.where({ target_type: 'loop', target_id: loopId }).orWhereRaw(`details->>'loopId' = ?`, [loopId]));
    return;
  }
  if (filter.targetType) q.where('target_type', filter.targetType);
  if (filter.targetId) q.where('target_id', filter.targetId);
}

export async function listAudit(db: Db, filter: AuditFilter) {
  const base = db('audit_log').modify((q) => applyFilter(q, filter));
  const [{ count }] = await base.clone().count<{ count: string }[]>('* as count');
  const rows = (await base.clone().orderBy('id', 'desc').limit(filter.limit).offset(filter.offset)) as Raw[];
  return {
    total: Number(count),
    items: rows.map((r) => ({
      id: String(r.id),
      at: r.at.toISOString(),
      actorEmail: r.actor_email,
      action: r.action,
      target: r.target_type ? `${r.target_type}:${r.target_id ?? ''}` : null,
      details: r.details,
    })),
  };
}
