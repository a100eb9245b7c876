import fs from 'node:fs';
import path from 'node:path';
import express, { type Express, type Router } from 'express';
import helmet from 'helmet';
import type { Sequelize } from 'sequelize';
import type { Config } from './config/index';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { healthRoutes } from './routes/health.routes';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  /** Built client to serve with a history fallback (production mode); omitted in dev and tests. */
  clientDir?: string;
  /** Extra API routers mounted under /api (the library, auth…). */
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

/** Builds the Express app without listening, so tests drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(helmet({ contentSecurityPolicy }));
  app.use(express.json({ limit: '1mb' }));

  const api = express.Router();
  api.use(healthRoutes(deps.sequelize, deps.config.version));
  for (const router of deps.apiRouters ?? []) api.use(router);
  api.use(apiNotFound);
  app.use('/api', api);

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
