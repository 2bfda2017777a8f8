import { z } from 'zod';
import type { Db } from '../../db/knex.js';
import { notFound } from '../../http/errors.js';
import type { RouteTable } from '../../http/route.js';

const DevMailSchema = z.object({
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  receivedAt: z.string(),
});

/** The development mailbox: mail captured by the local SMTP server; absent in a site installation. */
export function registerDevMailRoutes(routes: RouteTable, db: Db, enabled: boolean): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/dev/mail',
      access: ['admin'],
      tag: 'development',
      summary: 'Mail captured by the local mail server (newest first)',
      query: z.object({ limit: z.coerce.number().int().min(1).max(500).default(100) }),
      response: z.array(DevMailSchema),
    },
    async ({ query }) => {
      if (!enabled) throw notFound('The development mailbox (the local mail server is not in use)');
      const rows = await db('dev_mail')
        .orderBy('id', 'desc')
        .limit(query.limit)
        .select<{ to_addresses: string[]; subject: string; text: string; received_at: Date }[]>(
          'to_addresses',
          'subject',
          'text',
          'received_at',
        );
      return rows.map((r) => ({
        to: r.to_addresses,
        subject: r.subject,
        text: r.text,
        receivedAt: r.received_at.toISOString(),
      }));
    },
  );
}
