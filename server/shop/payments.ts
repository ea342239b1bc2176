import { createRequire } from 'node:module';
import type Stripe from 'stripe';
import type { Config } from '../config';
import { HttpError } from '../http/errors';

/** The payment provider as the shop uses it: the official SDK client and the webhook secret. */
export interface Payments {
  readonly stripe: Stripe;
  webhookSecret: string;
}

const require = createRequire(import.meta.url);

/**
 * The SDK client from the settings, or null when the shop has no keys. `config.stripe.api` points the
 * SDK at another host (the local fake on loopback); without it the SDK talks to the real service.
 * The SDK is loaded on the first payment call, not at server start (it is the largest module the
 * server would otherwise load before its first answer).
 */
export function createPayments(config: Pick<Config, 'stripe'>): Payments | null {
  const { secretKey, webhookSecret, api } = config.stripe;
  if (!secretKey || !webhookSecret) return null;
  let client: Stripe | undefined;
  return {
    get stripe(): Stripe {
      if (!client) {
        const StripeSdk = require('stripe') as typeof Stripe;
        client = new StripeSdk(secretKey, {
          ...(api ? { host: api.host, port: api.port, protocol: api.protocol } : {}),
          maxNetworkRetries: 2,
          timeout: 20_000,
          appInfo: { name: 'Seamwright' },
        });
      }
      return client;
    },
    webhookSecret,
  };
}

/** The payments client, or 503 when the server has no payment keys. */
export function requirePayments(payments: Payments | null): Payments {
  if (!payments) throw new HttpError(503, 'Payments are not set up on this server');
  return payments;
}
