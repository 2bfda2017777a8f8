import { z } from 'zod';
import { AuditEntrySchema } from '../../contracts/users.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { listAudit } from './audit.repository.js';

const AuditQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(50),
  offset: z.coerce.number().int().min(0).default(0),
  action: z.string().max(80).optional(),
  targetType: z.string().max(40).optional(),
  /** With targetType=loop, also the entries of the loop's model versions. */
  targetId: z.string().max(80).optional(),
});

export function registerAuditRoutes(routes: RouteTable, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/audit',
      access: ['admin', 'engineer'],
      tag: 'audit',
      summary:
        "The audit log, newest first; filter by action or target (targetType=loop&targetId=… gives a loop's log, its model versions included)",
      query: AuditQuerySchema,
      response: z.object({ items: z.array(AuditEntrySchema), total: z.number() }),
    },
    ({ query }) => listAudit(db, query),
  );
}
