import type { Config } from '../../config/config.js';
import type { Db } from '../../db/knex.js';
import type { RouteTable } from '../../http/route.js';
import { healthReport } from './health.service.js';

export function registerHealthRoutes(routes: RouteTable, config: Config, db: Db): void {
  routes.add(
    {
      method: 'get',
      path: '/api/health',
      access: 'public',
      tag: 'health',
      summary:
        'Database, mail server, identity provider and simulator heartbeat; 503 when the database does not answer',
    },
    async ({ res }) => {
      const report = await healthReport(config, db);
      res.status(report.httpStatus).json(report.body);
    },
  );
}
