import { z } from 'zod';
import {
  AcknowledgeBodySchema,
  AlertListQuerySchema,
  AlertSchema,
  AlertSuppressionQuerySchema,
  AlertSuppressionSchema,
  AlertWithEventsSchema,
  BulkAcknowledgeBodySchema,
  BulkAcknowledgeResultSchema,
  CloseBodySchema,
  LoopMaintenanceBodySchema,
  LoopMaintenanceSchema,
  ShelveBodySchema,
} from '../../contracts/alerts.js';
import type { RouteTable } from '../../http/route.js';
import type { AlertRouteDeps } from '../alert.routes.js';
import {
  acknowledgeAlert,
  acknowledgeAlerts,
  closeAlert,
  getAlert,
  listAlerts,
  publishAlertChanges,
  shelveAlert,
} from './alerts.service.js';
import { listSuppressions, setLoopMaintenance } from './maintenance.service.js';

/** The alert queue, one alert's timeline, the people's actions on alerts, and loop maintenance. */
export function registerAlertRoutes(routes: RouteTable, deps: AlertRouteDeps): void {
  const { db, publisher } = deps;
  const id = (params: Record<string, unknown>) => String(params.id);
  const updated = async <T extends { id: string }>(alert: T): Promise<T> => {
    await publishAlertChanges(db, publisher, [{ alertId: alert.id, type: 'updated' }]);
    return alert;
  };
  const tag = 'alerts';

  routes.add(
    {
      method: 'get',
      path: '/api/v1/alerts',
      access: 'signed-in',
      tag,
      summary:
        'Alerts, newest first (or `order=urgent`: waiting for acknowledgement first, then by priority); filter by state (comma-separated, `open` = all but closed), area, loop, priority, time',
      query: AlertListQuerySchema,
      response: z.array(AlertSchema),
    },
    ({ query }) => listAlerts(db, query),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/alerts/acknowledge',
      access: ['oncall'],
      tag,
      summary: 'Acknowledge several alerts; those that cannot be acknowledged are skipped with the reason',
      body: BulkAcknowledgeBodySchema,
      response: BulkAcknowledgeResultSchema,
    },
    async ({ user, body }) => {
      const result = await acknowledgeAlerts(db, user, body.ids, body.note);
      const changes = result.acknowledged.map((alertId) => ({ alertId, type: 'updated' as const }));
      await publishAlertChanges(db, publisher, changes);
      return result;
    },
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/alerts/:id',
      access: 'signed-in',
      tag,
      summary: 'One alert with its timeline of events (who and when)',
      response: AlertWithEventsSchema,
    },
    ({ req }) => getAlert(db, id(req.params)),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/alerts/:id/acknowledge',
      access: ['oncall'],
      tag,
      summary:
        'Acknowledge an unacknowledged or returned alert; 409 when it is already acknowledged, shelved or closed',
      body: AcknowledgeBodySchema,
      response: AlertSchema,
    },
    async ({ user, req, body }) => updated(await acknowledgeAlert(db, user, id(req.params), body.note)),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/alerts/:id/shelve',
      access: ['oncall'],
      tag,
      summary:
        'Shelve an open alert until a time (at most the shelving limit of the alert settings) with a reason; it comes back by itself',
      body: ShelveBodySchema,
      response: AlertSchema,
    },
    async ({ user, req, body }) => updated(await shelveAlert(db, user, id(req.params), body)),
  );

  routes.add(
    {
      method: 'post',
      path: '/api/v1/alerts/:id/close',
      access: ['oncall'],
      tag,
      summary: 'Close an open alert with the cause found and a note',
      body: CloseBodySchema,
      response: AlertSchema,
    },
    async ({ user, req, body }) => updated(await closeAlert(db, user, id(req.params), body)),
  );

  routes.add(
    {
      method: 'put',
      path: '/api/v1/loops/:loopId/maintenance',
      access: ['engineer', 'oncall'],
      tag,
      summary: 'Put a loop into maintenance (raises are recorded, nobody is called) or take it out; audited',
      body: LoopMaintenanceBodySchema,
      response: LoopMaintenanceSchema,
    },
    ({ user, req, body }) => setLoopMaintenance(db, user, String(req.params.loopId), body),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/loops/:loopId/alert-suppressions',
      access: 'signed-in',
      tag,
      summary: 'Raises recorded while the loop was in maintenance, newest first',
      query: AlertSuppressionQuerySchema,
      response: z.array(AlertSuppressionSchema),
    },
    ({ req, query }) => listSuppressions(db, String(req.params.loopId), query.limit),
  );
}
