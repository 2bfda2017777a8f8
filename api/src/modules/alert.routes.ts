import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import type { RouteTable } from '../http/route.js';
import type { TwinPublisher } from '../realtime/publisher.js';
import { registerAlertLoadRoutes } from './alert-load/alert-load.routes.js';
import { registerAlertRoutes } from './alerts/alerts.routes.js';
import { registerDriftRuleRoutes } from './drift-rules/drift-rules.routes.js';
import { registerOnCallRoutes } from './oncall/oncall.routes.js';

export interface AlertRouteDeps {
  config: Config;
  db: Db;
  publisher: TwinPublisher;
}

/** Divergence alerts: drift rules, alerts and their life cycle, the on-call rota, the alert-load report. */
export function registerAlertingRoutes(routes: RouteTable, deps: AlertRouteDeps): void {
  registerDriftRuleRoutes(routes, deps);
  // /api/v1/alerts/load before /api/v1/alerts/:id
  registerAlertLoadRoutes(routes, deps);
  registerAlertRoutes(routes, deps);
  registerOnCallRoutes(routes, deps);
}
