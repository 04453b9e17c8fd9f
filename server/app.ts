import express, { type Express } from 'express';
import type { Sequelize } from 'sequelize';
import type { AppContext } from './app-context';
import { createLucia } from './auth/lucia';
import { createSignInLimiters } from './auth/rate-limiter';
import type { Config } from './config';
import { setDesignRunsKept } from './services/design-run-storage';
import { errorHandler } from './middleware/error.middleware';
import { requestLog } from './middleware/request-log.middleware';
import { securityHeaders } from './middleware/security.middleware';
import { defineModels, type Models } from './models/models';
import { apiRoutes } from './routes/api.routes';
import { serveClient } from './static-client';
import { configureDesignRuns } from './services/design-runs/design-pool';

export interface CreateAppOptions {
  sequelize: Sequelize;
  config: Config;
  /** Models already defined on sequelize (from connectDatabase); defined here if absent. */
  models?: Models;
  /** Built client folder (dist/) to serve with the SPA fallback; null or absent: API only. */
  clientDir?: string | null;
  /** Where 5xx errors are logged. */
  logError?: (err: unknown) => void;
}

const CONTEXT = Symbol('baywright.context');

/** Builds the Express app without listening (tests use it in-process). */
export function createApp(options: CreateAppOptions): Express {
  const { sequelize, config } = options;
  const models = options.models ?? defineModels(sequelize);
  const ctx: AppContext = {
    config,
    db: { sequelize, models },
    lucia: createLucia(models, { cookieSecure: config.cookieSecure }),
    limiters: createSignInLimiters({ relaxed: config.rateLimitRelaxed }),
  };

  configureDesignRuns(config.designRuns);
  setDesignRunsKept(sequelize, config.designRunsKept);

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'simple');
  app.set('trust proxy', config.trustProxy);
  Object.defineProperty(app, CONTEXT, { value: ctx });

  app.use(securityHeaders());
  app.use(requestLog(config.nodeEnv));
  app.use('/api', apiRoutes(ctx));
  if (options.clientDir) serveClient(app, options.clientDir);
  app.use(errorHandler(options.logError));
  return app;
}

/** The context an app was built with (tests mint sessions and read models through it). */
export function getAppContext(app: Express): AppContext {
  return (app as unknown as Record<symbol, AppContext>)[CONTEXT];
}
