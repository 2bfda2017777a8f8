import type pg from 'pg';
import type { Config } from '../config/config.js';
import type { Db } from '../db/knex.js';
import type { RouteTable } from '../http/route.js';
import type { TwinPublisher } from '../realtime/publisher.js';
import { registerForecastRoutes } from './forecast/forecast.routes.js';
import { registerImportRoutes } from './imports/imports.routes.js';
import { registerIngestSourceRoutes } from './ingest-sources/ingest-sources.routes.js';
import type { PartitionKeeper } from './readings/partitions.js';
import { registerReadingRoutes } from './readings/readings.routes.js';
import { registerSeriesRoutes } from './series/series.routes.js';
import { registerTrackingRoutes } from './tracking/tracking.routes.js';

export interface LiveTwinDeps {
  config: Config;
  db: Db;
  pool: pg.Pool;
  partitions: PartitionKeeper;
  publisher: TwinPublisher;
}

/** The live twin's routes: ingest sources, readings and imports, trends, tracking, forecasts. */
export function registerLiveTwinRoutes(routes: RouteTable, deps: LiveTwinDeps): void {
  const { config, db } = deps;
  const shared = { db, partitions: deps.partitions, futureToleranceS: config.INGEST_FUTURE_TOLERANCE_S };
  registerIngestSourceRoutes(routes, db);
  registerReadingRoutes(routes, {
    ...shared,
    publisher: deps.publisher,
    maxAgeDays: config.INGEST_MAX_AGE_DAYS,
    synchronousCommit: config.INGEST_SYNCHRONOUS_COMMIT,
    ratePerMinute: config.INGEST_RATE_LIMIT_PER_MINUTE,
  });
  registerImportRoutes(routes, { ...shared, pool: deps.pool, maxFileBytes: config.IMPORT_MAX_FILE_MB * 1024 * 1024 });
  registerSeriesRoutes(routes, db);
  registerForecastRoutes(routes, db);
  registerTrackingRoutes(routes, db);
}
