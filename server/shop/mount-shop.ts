import express, { type Express, type Router } from 'express';
import type { AppContext } from '../app-context';
import { listingsRouter } from './listings-router';
import { ordersRouter } from './orders-router';
import { createPayments } from './payments';
import { webhookHandlers } from './webhook';

/**
 * Mounts the pattern shop. Call it while building the API router, before its 404 handler and before
 * `app.use('/api', api)`: the webhook goes on `app` so it runs ahead of the API's JSON parser (the
 * signature is over the raw body) and its CSRF check (the signature is the proof); everything else
 * goes on `api` under `/shop`, behind sessions and CSRF like every other route.
 */
export function mountShop(app: Express, api: Router, ctx: AppContext): void {
  const payments = createPayments(ctx.config);
  app.post('/api/shop/webhook', ...webhookHandlers(ctx, payments));
  const shop = express.Router();
  shop.use(listingsRouter(ctx));
  shop.use(ordersRouter(ctx, payments));
  api.use('/shop', shop);
}
