import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { csrfSync } from 'csrf-sync';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type pg from 'pg';
import { createAuthRouter } from './auth/auth.router.js';
import { bearerAuth } from './auth/bearer.js';
import { createPassport } from './auth/passport.js';
import { createSessionMiddleware } from './auth/session.js';
import type { Config } from './config/config.js';
import type { Db } from './db/knex.js';
import { apiNotFound, errorHandler } from './http/error-handler.js';
import { buildOpenApi } from './http/openapi.js';
import { createRouteTable } from './http/route.js';
import { registerAnalysisRoutes } from './modules/analysis/analysis.routes.js';
import { registerAreaRoutes } from './modules/areas/areas.routes.js';
import { registerLoopRoutes } from './modules/loops/loops.routes.js';
import { registerModelVersionRoutes } from './modules/model-versions/model-versions.routes.js';
import { registerReviewRoutes } from './modules/model-versions/review.routes.js';
import { registerAccessTokenRoutes } from './modules/access-tokens/access-tokens.routes.js';
import { registerAuditRoutes } from './modules/audit/audit.routes.js';
import { registerDevMailRoutes } from './modules/dev-mail/dev-mail.routes.js';
import { registerHealthRoutes } from './modules/health/health.routes.js';
import { registerUserRoutes } from './modules/users/users.routes.js';
import { registerLiveTwinRoutes } from './modules/live-twin.routes.js';
import { registerAlertingRoutes } from './modules/alert.routes.js';
import { registerBacktestRoutes } from './modules/backtests/backtests.routes.js';
import { createAckLinkRouter } from './modules/mail/ack-link.router.js';
import { configureAlertMail } from './modules/mail/alert-mail.js';
import { createPartitionKeeper, type PartitionKeeper } from './modules/readings/partitions.js';
import { createTwinPublisher, type TwinPublisher } from './realtime/publisher.js';
import { z } from 'zod';

export interface AppDeps {
  config: Config;
  db: Db;
  /** The pool behind db, shared with the session store. */
  pool: pg.Pool;
  logger: Logger;
  version: string;
  /** Where twin samples and status changes go (the realtime server attaches to it); silent when absent. */
  publisher?: TwinPublisher;
  /** Shared with the hourly partition upkeep so that both know which days exist. */
  partitions?: PartitionKeeper;
}

/** Builds the Express app without listening (tests start it on port 0). */
export function createApp(deps: AppDeps): Express {
  const { config, db, pool, logger } = deps;
  const app = express();
  app.set('trust proxy', 'loopback');
  app.disable('x-powered-by');
  // form-action must admit the identity provider: the sign-in form's redirect goes there.
  const csp = {
    'img-src': ["'self'", 'data:', 'blob:'],
    'form-action': ["'self'", new URL(config.OIDC_ISSUER).origin],
    'upgrade-insecure-requests': null,
  };
  app.use(helmet({ contentSecurityPolicy: { directives: csp } }));
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));
  // Readings batches (up to 5,000 readings of up to 100 signals) may exceed the general 2 MB limit.
  app.use('/api/v1/loops/:loopId/readings', express.json({ limit: `${config.INGEST_MAX_BODY_MB}mb` }));
  app.use(express.json({ limit: '2mb' }));
  app.use(createSessionMiddleware(config, pool));

  const passport = createPassport(config, db);
  app.use(passport.initialize());
  app.use(passport.session());
  app.use(bearerAuth(db));

  const { generateToken, isRequestValid } = csrfSync({ getTokenFromRequest: (req) => req.get('x-csrf-token') });
  const routes = createRouteTable(isRequestValid);
  app.use(createAuthRouter({ config, db, passport, csrfValid: isRequestValid }));
  // alert e-mails link back here; their one-click acknowledge links are signed with a key from SESSION_SECRET
  configureAlertMail({ publicUrl: config.PUBLIC_URL, secret: config.SESSION_SECRET });

  routes.add(
    {
      method: 'get',
      path: '/api/v1/csrf-token',
      access: 'signed-in',
      tag: 'security',
      summary: 'The CSRF token for state-changing browser requests (header x-csrf-token)',
      response: z.object({ token: z.string() }),
    },
    ({ req }) => ({ token: generateToken(req) }),
  );
  registerHealthRoutes(routes, config, db);
  registerUserRoutes(routes, db);
  registerAccessTokenRoutes(routes, db);
  registerAuditRoutes(routes, db);
  registerDevMailRoutes(routes, db, config.DEV_MAILBOX);
  registerAreaRoutes(routes, db);
  registerLoopRoutes(routes, db);
  registerModelVersionRoutes(routes, db);
  const publisher = deps.publisher ?? createTwinPublisher();
  registerReviewRoutes(routes, db, publisher);
  registerAnalysisRoutes(routes);
  registerLiveTwinRoutes(routes, {
    config,
    db,
    pool,
    partitions: deps.partitions ?? createPartitionKeeper(db),
    publisher,
  });
  registerAlertingRoutes(routes, { config, db, publisher });
  registerBacktestRoutes(routes, { db, config });
  const openApi = buildOpenApi(routes, deps.version);
  routes.add(
    {
      method: 'get',
      path: '/api/v1/openapi.json',
      access: 'public',
      tag: 'documentation',
      summary: 'This OpenAPI document',
    },
    () => openApi,
  );

  app.use(routes.router);
  app.use(createAckLinkRouter({ config, db, publisher }));
  app.use(['/api', '/auth'], apiNotFound);
  serveWebApp(app, config.WEB_DIST);
  app.use(errorHandler);
  return app;
}

/** The built web app, with index.html for every client-side route. */
function serveWebApp(app: Express, dist: string): void {
  const index = path.join(dist, 'index.html');
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (_req, res) => {
    if (fs.existsSync(index)) res.sendFile(index);
    else
      res.status(503).type('text').send('The web app is not built yet: run npm run build (npm start does it for you).');
  });
}
