import {
  AlertSettingsSchema,
  AreaEngineersEntrySchema,
  AreaEngineersSchema,
  SaveAlertSettingsBodySchema,
  SetAreaEngineersBodySchema,
} from '../../contracts/alerts.js';
import type { RouteTable } from '../../http/route.js';
import type { AlertRouteDeps } from '../alert.routes.js';
import { readAlertSettings, saveAlertSettings } from './alert-settings.js';
import { listAreaEngineers, setAreaEngineers } from './area-engineers.js';

/** Escalation's last step (each area's engineers) and the alert settings. */
export function registerRotaSettingsRoutes(routes: RouteTable, { db }: AlertRouteDeps): void {
  routes.add(
    {
      method: 'get',
      path: '/api/v1/oncall/area-engineers',
      access: 'signed-in',
      tag: 'on-call rota',
      summary: "Each area's engineers: who an unacknowledged alert escalates to after the secondary",
      response: AreaEngineersSchema,
    },
    () => listAreaEngineers(db),
  );

  routes.add(
    {
      method: 'put',
      path: '/api/v1/oncall/area-engineers/:area',
      access: ['admin'],
      tag: 'on-call rota',
      summary: "Replace an area's engineers; each must hold the engineer role (422 otherwise)",
      body: SetAreaEngineersBodySchema,
      response: AreaEngineersEntrySchema,
    },
    ({ user, req, body }) => setAreaEngineers(db, user, String(req.params.area), body.userIds),
  );

  routes.add(
    {
      method: 'get',
      path: '/api/v1/alert-settings',
      access: 'signed-in',
      tag: 'alerts',
      summary: 'Escalation timings, acknowledge-link lifetime, shelving limit and the alert-load targets',
      response: AlertSettingsSchema,
    },
    () => readAlertSettings(db),
  );

  routes.add(
    {
      method: 'put',
      path: '/api/v1/alert-settings',
      access: ['admin'],
      tag: 'alerts',
      summary: 'Replace the alert settings (every field); areaAfterMin must be greater than secondaryAfterMin',
      body: SaveAlertSettingsBodySchema,
      response: AlertSettingsSchema,
    },
    ({ user, body }) => saveAlertSettings(db, user, body),
  );
}
