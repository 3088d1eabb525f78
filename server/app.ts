import { existsSync } from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { randomUUID } from 'node:crypto';
import type pg from 'pg';
import { createLoginThrottle } from './auth/login-throttle';
import { createResetThrottle } from './auth/reset-throttle';
import { createPassport } from './auth/passport';
import type { AppContext } from './core/context';
import { createCsrf } from './core/csrf';
import { errorHandler } from './core/error-handler';
import { notFound } from './core/errors';
import { buildOpenApiDocument } from './core/openapi';
import { buildRouter } from './core/register-routes';
import { rejectNulCharacters } from './core/reject-nul';
import { createSessionMiddleware, enforceAbsoluteTimeout, sessionCookieName } from './core/session';
import { allRoutes } from './routes';

const VERSION: string = (require('../package.json') as { version: string }).version;

function storageOrigin(endpoint: string | undefined): string[] {
  if (!endpoint) return [];
  try {
    return [new URL(endpoint).origin];
  } catch {
    return [];
  }
}

/** Builds the Express application: security headers, sessions, CSRF, the API and the built client. */
export function createApp(ctx: AppContext, pool: pg.Pool): Express {
  const { config, logger } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy ? 1 : false);
  app.set('sessionCookieName', sessionCookieName(config));

  app.use(
    pinoHttp({
      logger,
      genReqId: (req) => (req.headers['x-request-id'] as string | undefined)?.slice(0, 64) || randomUUID(),
      // Health and readiness probes every few seconds would drown the log.
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') || req.url.startsWith('/api/health') || req.url.startsWith('/api/ready') },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
    }),
  );

  const media = storageOrigin(config.s3.endpoint);
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          // Angular Material and the CDK set inline styles at runtime.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:', ...media],
          'media-src': ["'self'", 'blob:', ...media],
          'connect-src': ["'self'", ...media],
          'font-src': ["'self'", 'data:'],
          'object-src': ["'none'"],
          // Angular's index.html sets <base href="/">; 'self' still stops a base pointing elsewhere.
          'base-uri': ["'self'"],
          'form-action': ["'self'"],
          'frame-ancestors': ["'none'"],
          ...(config.secureCookies ? { 'upgrade-insecure-requests': [] } : {}),
        },
      },
      hsts: config.secureCookies,
      crossOriginEmbedderPolicy: false,
    }),
  );

  const passport = createPassport(ctx);
  const csrf = createCsrf(config, logger);
  const throttle = createLoginThrottle(config, pool);
  const resetThrottle = createResetThrottle(pool);

  app.use(cookieParser());
  app.use(createSessionMiddleware(config, pool, ctx.now, logger));
  app.use(passport.initialize());
  app.use(passport.session());
  app.use(enforceAbsoluteTimeout(config, ctx.now));
  app.use(csrf.middleware);

  const routes = allRoutes({ passport, throttle, resetThrottle, csrf, version: VERSION, startedAt: Date.now() });
  const mounted = routes.filter((r) => !(r.developmentOnly && config.env === 'production'));
  const openApi = buildOpenApiDocument(mounted, VERSION);

  const api = express.Router();
  api.use(express.json({ limit: '2mb' }));
  api.use(rejectNulCharacters);
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.get('/openapi.json', (_req, res) => {
    res.json(openApi);
  });
  api.use(buildRouter(ctx, mounted));
  api.use((req) => {
    throw notFound(`${req.method} ${req.baseUrl}${req.path}`);
  });
  app.use('/api', api);

  const staticDir = path.resolve(config.staticDir);
  const indexHtml = path.join(staticDir, 'index.html');
  if (existsSync(indexHtml)) {
    app.use(express.static(staticDir, { index: false, maxAge: '1y', immutable: true }));
    app.get('/{*splat}', (_req, res) => {
      res.set('Cache-Control', 'no-cache');
      res.sendFile(indexHtml);
    });
  } else {
    logger.warn({ staticDir }, 'no built client found; serving the API only');
  }

  app.use(errorHandler(logger));
  return app;
}
