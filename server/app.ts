import express, { type Express } from 'express';
import cookieParser from 'cookie-parser';
import type { AppContext } from './app-context';
import { createCsrf } from './auth/csrf';
import { loadSession } from './auth/sessions';
import { apiNotFound, errorMiddleware } from './http/errors';
import { installHotRoutes } from './http/hot-routes';
import { jsonBodies } from './http/json-bodies';
import { patternAccess } from './http/pattern-access';
import { securityHeaders } from './http/security';
import { staticAppRouter } from './http/static-app';
import { adminRouter } from './routes/admin';
import { authRouter } from './routes/auth';
import { colourwayCopiesRouter } from './routes/colourway-copies';
import { healthRouter } from './routes/health';
import { invitationsRouter } from './routes/invitations';
import { membersRouter } from './routes/members';
import { patternsRouter } from './routes/patterns';
import { printSetsRouter } from './routes/print-sets';
import { revisionsRouter } from './routes/revisions';
import { sewingLogRouter } from './routes/sewing-log';
import { uploadsRouter } from './routes/uploads';
import { mountShop } from './shop/mount-shop';

/** Builds the Express app: security headers, JSON, the API under /api, the built app, errors. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.set('query parser', 'simple');
  // No ETag hash of every JSON answer: API answers are Cache-Control: no-store (the built app's files
  // get theirs from express.static, which does not use this setting).
  app.set('etag', false);
  app.use(securityHeaders());

  const csrf = createCsrf(ctx.config);
  const api = express.Router();
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.use(cookieParser());
  api.use(loadSession(ctx.data));
  api.use(healthRouter());
  // Every POST, PUT, PATCH and DELETE below needs the X-CSRF-Token header (read from the header only).
  api.use(csrf.protect);
  // Every route about one pattern finds it and the caller's access here (or answers 404) first.
  api.use('/patterns/:id', patternAccess(ctx.data));
  // Bodies are read only now, after the session, CSRF and access checks: bounded per route and by depth.
  api.use(jsonBodies(ctx.config.jsonBodyLimit));
  api.use('/auth', authRouter(ctx, csrf));
  api.use('/admin', adminRouter(ctx));
  api.use('/invitations', invitationsRouter(ctx));
  api.use('/patterns/:id/revisions', revisionsRouter(ctx));
  api.use('/patterns/:id/sewing-log', sewingLogRouter(ctx));
  api.use('/patterns/:id/uploads', uploadsRouter(ctx));
  api.use('/patterns/:id/print-sets', printSetsRouter(ctx));
  api.use('/patterns/:id/colourway-copies', colourwayCopiesRouter(ctx));
  api.use('/patterns/:id', membersRouter(ctx));
  api.use('/patterns', patternsRouter(ctx));
  mountShop(app, api, ctx);
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(staticAppRouter(ctx.config.staticDir));
  app.use((_req, res) => {
    res.status(404).json({ error: 'Not found', details: null });
  });
  app.use(errorMiddleware((err) => ctx.log('request failed', err)));
  // Reads, lists and small saves of patterns are answered in front of Express, the same way (server/http/hot-routes.ts).
  // The hot routes answer from SQLite's prepared statements; on PostgreSQL every request goes through Express.
  if (ctx.data.dialect === 'sqlite') installHotRoutes(app, ctx, csrf);
  return app;
}
