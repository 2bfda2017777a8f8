import { AlertLoadQuerySchema, AlertLoadSchema } from '../../contracts/alerts.js';
import type { RouteTable } from '../../http/route.js';
import type { AlertRouteDeps } from '../alert.routes.js';
import { alertLoadCsv, alertLoadFilename } from './alert-load-csv.js';
import { buildAlertLoad } from './alert-load.service.js';

/** The alert-load report and its CSV download (registered before /api/v1/alerts/:id). */
export function registerAlertLoadRoutes(routes: RouteTable, { db }: AlertRouteDeps): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/alerts/load',
      access: 'signed-in',
      tag: 'alerts',
      summary:
        'Alert load over [from, to) (default the last 7 days, at most 92): activations per UTC day and per 10 minutes against the targets, floods, chattering, stale alerts, top ten loops, mean time to acknowledge',
      query: AlertLoadQuerySchema,
      response: AlertLoadSchema,
    },
    ({ query }) => buildAlertLoad(db, query),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/alerts/load.csv',
      access: 'signed-in',
      tag: 'alerts',
      summary:
        'The alert-load report as a CSV download: one block per table (summary, per day, per 10 min, floods, chattering, stale, top loops), each with a header row and a "section" column',
      query: AlertLoadQuerySchema,
    },
    async ({ res, query }) => {
      const load = await buildAlertLoad(db, query);
      res.attachment(alertLoadFilename(load)).type('text/csv').send(alertLoadCsv(load));
    },
  );
}
