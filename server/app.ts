import express from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import type pg from 'pg';
import type { DataSource } from 'typeorm';
import { authRoutes } from './auth/auth.routes.js';
import { loadCurrentUser } from './auth/current-user.js';
import { OidcRelyingParty } from './auth/oidc.js';
import { sessionMiddleware } from './auth/session.js';
import type { Config } from './config/env.js';
import { dischargePointsRoutes } from './features/discharge-points/discharge-points.routes.js';
import { equipmentRoutes } from './features/equipment/equipment.routes.js';
import { flowReadingsRoutes } from './features/flow-readings/flow-readings.routes.js';
import { followUpsRoutes } from './features/follow-ups/follow-ups.routes.js';
import { healthRoutes } from './features/health/health.routes.js';
import { periodsRoutes } from './features/periods/periods.routes.js';
import { oilLogRoutes } from './features/oil-log/oil-log.routes.js';
import { oilOnHandRoutes } from './features/oil-log/oil-on-hand.routes.js';
import { shipmentsRoutes } from './features/shipments/shipments.routes.js';
import { upkeepChecksRoutes } from './features/upkeep/upkeep-checks.routes.js';
import { labCertificatesRoutes } from './features/lab/lab-certificates.routes.js';
import { parametersRoutes } from './features/parameters/parameters.routes.js';
import { permitsRoutes } from './features/permits/permits.routes.js';
import { sitesRoutes } from './features/sites/sites.routes.js';
import { trailRoutes } from './features/trail/trail.routes.js';
import { importRunsRoutes } from './features/imports/imports.routes.js';
import { meRoutes } from './features/users/me.routes.js';
import { mailPreferencesRoutes, unsubscribeRoutes } from './features/notices/notices.routes.js';
import { toolsRoutes } from './features/tools/tools.routes.js';
import { usersRoutes } from './features/users/users.routes.js';
import { apiNotFound, errorHandler } from './middleware/error-handler.js';
import { signInRateLimit, writeRateLimit } from './middleware/rate-limits.js';
import { sameOrigin } from './middleware/same-origin.js';
import { mountRouter } from './openapi/mounts.js';
import { openApiRoutes } from './openapi/openapi.routes.js';

export interface AppDependencies {
  config: Config;
  dataSource: DataSource;
  sessionPool: pg.Pool;
  /** The built client (vite build); absent in API-only tests and in `npm run dev`. */
  clientDir?: string;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp({ config, dataSource, sessionPool, clientDir }: AppDependencies): express.Express {
  const app = express();
  app.disable('x-powered-by');
  if (config.trustProxy !== undefined) app.set('trust proxy', config.trustProxy);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // The sign-in redirect goes to the identity provider's origin.
          'form-action': ["'self'", new URL(config.oidc.issuer).origin],
          'img-src': ["'self'", 'data:', 'blob:'],
          'frame-src': ["'self'", 'blob:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  mountRouter(api, '/health', healthRoutes(dataSource));
  // From a mail, without a session: the signed token is the authority (and RFC 8058 posts cross-site).
  mountRouter(api, '/mail/unsubscribe', unsubscribeRoutes(dataSource, config.sessionSecret));
  api.use(sessionMiddleware(config, sessionPool));
  api.use(sameOrigin(config.appUrl));
  api.use(writeRateLimit());
  api.use(['/auth/sign-in', '/auth/callback'], signInRateLimit());
  api.use(loadCurrentUser(dataSource));
  mountRouter(api, '/auth', authRoutes(config, dataSource, new OidcRelyingParty(config)));
  mountRouter(api, '/me', meRoutes(dataSource));
  mountRouter(api, '/mail/preferences', mailPreferencesRoutes(dataSource));
  mountRouter(api, '/tools', toolsRoutes(dataSource));
  mountRouter(api, '/users', usersRoutes(dataSource));
  mountRouter(api, '/sites/:siteId/discharge-points', dischargePointsRoutes(dataSource));
  mountRouter(api, '/sites/:siteId/oil-on-hand', oilOnHandRoutes(dataSource));
  mountRouter(api, '/sites', sitesRoutes(dataSource));
  mountRouter(api, '/parameters', parametersRoutes(dataSource));
  mountRouter(api, '/permits', permitsRoutes(dataSource));
  mountRouter(api, '/lab-certificates', labCertificatesRoutes(dataSource));
  mountRouter(api, '/equipment', equipmentRoutes(dataSource));
  mountRouter(api, '/oil-log', oilLogRoutes(dataSource));
  mountRouter(api, '/upkeep-checks', upkeepChecksRoutes(dataSource));
  mountRouter(api, '/shipments', shipmentsRoutes(dataSource));
  mountRouter(api, '/flow-readings', flowReadingsRoutes(dataSource));
  mountRouter(api, '/periods', periodsRoutes(dataSource));
  mountRouter(api, '/follow-ups', followUpsRoutes(dataSource));
  mountRouter(api, '/trail', trailRoutes(dataSource));
  mountRouter(api, '/import-runs', importRunsRoutes(dataSource));
  mountRouter(api, '/openapi.json', openApiRoutes(api));
  api.use(apiNotFound);
  app.use('/api', api);

  if (clientDir && existsSync(resolve(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    // The client's router owns every other path (history mode).
    app.get('/{*path}', (_req, res) => res.sendFile(resolve(clientDir, 'index.html'), { maxAge: 0 }));
  }
  app.use(errorHandler);
  return app;
}
