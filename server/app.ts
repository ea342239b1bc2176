import express, { type Express } from 'express';
import cookieParser from 'cookie-parser';
import type { AppContext } from './app-context';
import { apiNotFound, errorMiddleware } from './http/errors';
import { securityHeaders } from './http/security';
import { staticAppRouter } from './http/static-app';
import { healthRouter } from './routes/health';

/** Builds the Express app: security headers, JSON, the API under /api, the built app, errors. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.set('query parser', 'simple');
  app.use(securityHeaders());
  app.use(express.json({ limit: ctx.config.jsonBodyLimit, strict: true }));
  app.use(cookieParser());

  const api = express.Router();
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(healthRouter());
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(staticAppRouter(ctx.config.staticDir));
  app.use((_req, res) => {
    res.status(404).json({ error: 'Not found', details: null });
  });
  app.use(errorMiddleware((err) => ctx.log('request failed', err)));
  return app;
}
