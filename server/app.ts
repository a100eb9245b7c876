import fs from 'node:fs';
import path from 'node:path';
import express, { type Express, type Router } from 'express';
import helmet from 'helmet';
import type { Sequelize } from 'sequelize';
import type { Config } from './config/index';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { initModels } from './models/index';
import { createSessionMiddleware } from './auth/session';
import { configurePassport } from './auth/passport';
import { csrf } from './auth/csrf';
import { createMailer, type Mailer } from './mail/mailer';
import { healthRoutes } from './routes/health.routes';
import { authRoutes } from './routes/auth.routes';
import { teamRoutes } from './routes/teams.routes';
import { partRoutes } from './routes/parts.routes';
import { studyRoutes } from './routes/studies.routes';
import { inviteRoutes } from './routes/invites.routes';
import { devRoutes } from './routes/dev.routes';
import { runLogRoutes } from './routes/run-logs.routes';
import { closeSummaryPool } from './services/revision-summary.service';
import { installCacheInvalidation } from './services/read-caches';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  /** Built client to serve with a history fallback (production mode); omitted in dev and tests. */
  clientDir?: string;
  /** Sends invitation mail; defaults to SMTP per config.mail. */
  mailer?: Mailer;
  /** Extra API routers mounted under /api after the library's own (behind session, auth and CSRF). */
  apiRouters?: Router[];
  /** Where unexpected errors are logged; tests pass a silent logger. */
  logError?: (err: unknown) => void;
}

/**
 * Content Security Policy the built client satisfies: our own scripts and
 * workers (Vite emits workers as files; blob: covers module-worker shims),
 * inline style attributes from React, fonts shipped with the app.
 */
const contentSecurityPolicy = {
  useDefaults: false,
  directives: {
    defaultSrc: ["'self'"],
    scriptSrc: ["'self'"],
    workerSrc: ["'self'", 'blob:'],
    styleSrc: ["'self'", "'unsafe-inline'"],
    fontSrc: ["'self'", 'data:'],
    imgSrc: ["'self'", 'data:', 'blob:'],
    connectSrc: ["'self'"],
    objectSrc: ["'none'"],
    baseUri: ["'self'"],
    formAction: ["'self'"],
    frameAncestors: ["'none'"],
  },
};

export type DwellformApp = Express & { locals: { shutdown: () => Promise<void> } };

/**
 * Builds the Express app without listening, so tests drive it with supertest.
 * Call `app.locals.shutdown()` when done: it stops the session expiry timer
 * and the mail transport (the caller owns the Sequelize connection).
 */
export function createApp(deps: AppDeps): DwellformApp {
  const { config, sequelize } = deps;
  initModels(sequelize);
  installCacheInvalidation();
  const app = express() as DwellformApp;
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(helmet({ contentSecurityPolicy }));
  app.use(express.json({ limit: '1mb' }));

  const sessions = createSessionMiddleware(config, sequelize);
  const passport = configurePassport(config);
  const mailer = deps.mailer ?? createMailer(config.mail);
  const inviteCtx = { sequelize, mailer, publicUrl: config.publicUrl, ttlHours: config.inviteTtlHours };

  const api = express.Router();
  // Health first: it must answer even when sessions (in the database) cannot load.
  api.use(healthRoutes(sequelize, config.version));
  api.use(sessions.middleware, passport.initialize(), passport.session());
  // Every POST/PUT/PATCH/DELETE below needs the session's CSRF token.
  api.use(csrf.csrfSynchronisedProtection);
  api.use(authRoutes(config, passport));
  api.use(teamRoutes(sequelize, inviteCtx));
  api.use(partRoutes(sequelize));
  api.use(studyRoutes(sequelize));
  api.use(inviteRoutes(sequelize));
  api.use(runLogRoutes(sequelize));
  if (config.mail.fakeMailboxUrl) api.use(devRoutes(config.mail.fakeMailboxUrl));
  for (const router of deps.apiRouters ?? []) api.use(router);
  api.use(apiNotFound);
  app.use('/api', api);
  app.locals.shutdown = async () => {
    sessions.close();
    if (!deps.mailer) mailer.close();
    await closeSummaryPool();
  };

  if (deps.clientDir) {
    const indexHtml = path.join(deps.clientDir, 'index.html');
    if (!fs.existsSync(indexHtml)) {
      throw new Error(`Built client not found at ${indexHtml}; run \`npx vite build\` first.`);
    }
    // Hashed assets can be cached for good; index.html must always be fresh.
    app.use(
      express.static(deps.clientDir, {
        index: false,
        setHeaders: (res, file) => {
          if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        },
      }),
    );
    app.get('/{*splat}', (_req, res) => {
      res.set('Cache-Control', 'no-cache').sendFile(indexHtml);
    });
  }

  app.use(errorHandler(deps.logError));
  return app;
}
