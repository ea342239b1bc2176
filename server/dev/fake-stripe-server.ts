/**
 * A small local fake of the payment provider for development and tests, on loopback. It answers the
 * part of the provider's REST API the shop uses, in the shape the official `stripe` SDK sends and reads
 * (form-encoded bodies, `Authorization: Bearer sk_…`, JSON answers, `{ error: { type, message } }`):
 *
 *   POST /v1/checkout/sessions             → a Checkout Session with `url` = our hosted page
 *   GET  /v1/checkout/sessions/:id         → the session
 *   POST /v1/checkout/sessions/:id/expire  → expires an open session (event `checkout.session.expired`)
 *   POST /v1/refunds                       → refunds a payment intent or charge (event `charge.refunded`)
 *   GET  /v1/refunds/:id                   → the refund
 *
 * and a hosted checkout page where the buyer confirms (`GET /checkout/:id`, form posts to
 * `/checkout/:id/pay` or `/checkout/:id/cancel`). Every event is posted to the webhook URL as JSON with a
 * `Stripe-Signature` header made by the SDK's `webhooks.generateTestHeaderString` with the webhook
 * secret, and kept for inspection at `GET /_fake/events` (with the exact payload and header, so a test
 * can replay one). `GET /_fake/health` answers `{ ok: true }`.
 *
 * Standalone: `tsx server/dev/fake-stripe-server.ts` (FAKE_STRIPE_HOST 127.0.0.1, FAKE_STRIPE_PORT
 * 12111, FAKE_STRIPE_WEBHOOK_URL http://127.0.0.1:4200/api/shop/webhook, STRIPE_SECRET_KEY and
 * STRIPE_WEBHOOK_SECRET as the server has them, FAKE_STRIPE_PUBLIC_URL for the hosted page's address).
 */
import crypto from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import Stripe from 'stripe';

/** A Checkout Session as the fake keeps it (the fields the provider documents that the shop reads). */
export interface FakeCheckoutSession {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  customer_details: { email: string | null } | null;
  metadata: Record<string, string>;
  line_items_summary: { name: string; description: string | null; unit_amount: number; quantity: number }[];
  payment_intent: string | null;
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  created: number;
  expires_at: number;
  livemode: false;
}

interface FakeCharge {
  id: string;
  object: 'charge';
  amount: number;
  amount_refunded: number;
  currency: string;
  paid: true;
  refunded: boolean;
  status: 'succeeded';
  payment_intent: string;
  metadata: Record<string, string>;
  created: number;
  livemode: false;
}

interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  charge: string;
  currency: string;
  payment_intent: string;
  status: 'succeeded';
  reason: string | null;
  metadata: Record<string, string>;
  created: number;
}

/** One event the fake sent, with exactly what went over the wire. */
export interface FakeEventDelivery {
  id: string;
  type: string;
  payload: string;
  signature: string;
  /** HTTP statuses of each delivery attempt (0 when the webhook URL could not be reached). */
  attempts: number[];
}

export interface FakeStripeOptions {
  host?: string;
  /** 0 picks a free port. */
  port?: number;
  /** The address buyers' browsers use for the hosted page (default http://host:port). */
  publicUrl?: string;
  /** Where events are posted; may be set later with `setWebhookUrl`. */
  webhookUrl?: string;
  webhookSecret: string;
  /** The secret key clients must send; any `sk_test_…` key when omitted. */
  apiKey?: string;
  /** Delivery retries after a failed attempt (the real service retries for days). */
  retries?: number;
}

export interface FakeStripeServer {
  host: string;
  port: number;
  /** Base URL of the API and the hosted pages. */
  url: string;
  sessions: Map<string, FakeCheckoutSession>;
  events: FakeEventDelivery[];
  setWebhookUrl(url: string): void;
  /** Completes a session as the hosted page's Pay button does; resolves after the first delivery. */
  pay(sessionId: string): Promise<FakeCheckoutSession>;
  close(): Promise<void>;
}

class StripeApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly type = 'invalid_request_error',
  ) {
    super(message);
  }
}

const id = (prefix: string) => `${prefix}_test_${crypto.randomBytes(12).toString('base64url').replace(/[-_]/g, 'x')}`;
const now = () => Math.floor(Date.now() / 1000);
const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

/** Amount in minor units as money text, with the currency's own number of decimals (ISO 4217). */
function money(minor: number, currency: string): string {
  const format = new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(minor / 10 ** digits);
}

const str = (v: unknown): string | undefined => (typeof v === 'string' ? v : undefined);
const int = (v: unknown, param: string): number => {
  if (typeof v !== 'string' || !/^\d{1,12}$/.test(v)) throw new StripeApiError(400, `Invalid integer: ${String(v)}`, param);
  return Number(v);
};
const record = (v: unknown): Record<string, string> => {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return {};
  return Object.fromEntries(Object.entries(v as Record<string, unknown>).filter((e): e is [string, string] => typeof e[1] === 'string'));
};
const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : v && typeof v === 'object' ? Object.values(v) : []);

/** Starts the fake payment provider. */
export async function startFakeStripeServer(options: FakeStripeOptions): Promise<FakeStripeServer> {
  const host = options.host ?? '127.0.0.1';
  const retries = options.retries ?? 3;
  const signer = new Stripe(options.apiKey ?? 'sk_test_fake_signer');
  const sessions = new Map<string, FakeCheckoutSession>();
  const charges = new Map<string, FakeCharge>();
  const refunds = new Map<string, FakeRefund>();
  const events: FakeEventDelivery[] = [];
  const idempotent = new Map<string, { status: number; body: unknown }>();
  let webhookUrl = options.webhookUrl;
  let baseUrl = '';

  async function attempt(delivery: FakeEventDelivery): Promise<boolean> {
    if (!webhookUrl) {
      delivery.attempts.push(0);
      return false;
    }
    try {
      const res = await fetch(webhookUrl, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': delivery.signature,
          'user-agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: delivery.payload,
        signal: AbortSignal.timeout(10_000),
      });
      await res.arrayBuffer();
      delivery.attempts.push(res.status);
      return res.ok;
    } catch {
      delivery.attempts.push(0);
      return false;
    }
  }

  /** Sends an event; resolves after the first attempt, retrying in the background on failure. */
  async function emit(type: string, object: unknown): Promise<FakeEventDelivery> {
    const event = {
      id: id('evt'),
      object: 'event',
      api_version: Stripe.API_VERSION,
      created: now(),
      data: { object },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    const payload = JSON.stringify(event, null, 2);
    const signature = signer.webhooks.generateTestHeaderString({ payload, secret: options.webhookSecret });
    const delivery: FakeEventDelivery = { id: event.id, type, payload, signature, attempts: [] };
    events.push(delivery);
    if (!(await attempt(delivery))) {
      void (async () => {
        for (let i = 0; i < retries; i++) {
          await new Promise((r) => setTimeout(r, 500 * 2 ** i).unref());
          if (await attempt(delivery)) return;
        }
      })();
    }
    return delivery;
  }

  function sessionOr404(sessionId: string): FakeCheckoutSession {
    const s = sessions.get(sessionId);
    if (!s) throw new StripeApiError(404, `No such checkout.session: '${sessionId}'`, 'id');
    return s;
  }

  async function pay(sessionId: string): Promise<FakeCheckoutSession> {
    const s = sessionOr404(sessionId);
    if (s.status !== 'open') throw new StripeApiError(400, `This Checkout Session is ${s.status}`);
    const paymentIntent = id('pi');
    const charge: FakeCharge = {
      id: id('ch'),
      object: 'charge',
      amount: s.amount_total,
      amount_refunded: 0,
      currency: s.currency,
      paid: true,
      refunded: false,
      status: 'succeeded',
      payment_intent: paymentIntent,
      metadata: s.metadata,
      created: now(),
      livemode: false,
    };
    charges.set(charge.id, charge);
    s.status = 'complete';
    s.payment_status = 'paid';
    s.payment_intent = paymentIntent;
    s.customer_details = { email: s.customer_email };
    s.url = null;
    await emit('checkout.session.completed', s);
    return s;
  }

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true, limit: '100kb' }));

  // --- The API, for the SDK.
  const api = express.Router();
  api.use((req, _res, next) => {
    const auth = req.headers.authorization ?? '';
    const key = auth.startsWith('Bearer ') ? auth.slice(7) : '';
    const ok = options.apiKey ? key === options.apiKey : key.startsWith('sk_test_');
    next(ok ? undefined : new StripeApiError(401, 'Invalid API Key provided', undefined, 'invalid_request_error'));
  });
  // Replays of a POST with the same Idempotency-Key get the first answer, as the real service does.
  api.use((req, res, next) => {
    const key = req.method === 'POST' ? req.headers['idempotency-key'] : undefined;
    if (typeof key !== 'string') return next();
    const cacheKey = `${key}|${req.path}`;
    const seen = idempotent.get(cacheKey);
    if (seen) {
      res.status(seen.status).set('idempotent-replayed', 'true').json(seen.body);
      return;
    }
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      idempotent.set(cacheKey, { status: res.statusCode, body });
      return json(body);
    };
    next();
  });

  api.post('/checkout/sessions', (req, res) => {
    const b = req.body as Record<string, unknown>;
    if (str(b['mode']) !== 'payment') throw new StripeApiError(400, 'Only mode=payment is supported by the fake', 'mode');
    const successUrl = str(b['success_url']);
    if (!successUrl) throw new StripeApiError(400, 'Missing required param: success_url.', 'success_url');
    const items = list(b['line_items']).map((raw, i) => {
      const item = (raw ?? {}) as Record<string, unknown>;
      const price = (item['price_data'] ?? {}) as Record<string, unknown>;
      const product = (price['product_data'] ?? {}) as Record<string, unknown>;
      const currency = str(price['currency'])?.toLowerCase();
      const name = str(product['name']);
      if (!currency || !/^[a-z]{3}$/.test(currency)) throw new StripeApiError(400, 'Missing currency', `line_items[${i}][price_data][currency]`);
      if (!name) throw new StripeApiError(400, 'Missing product name', `line_items[${i}][price_data][product_data][name]`);
      return {
        name,
        description: str(product['description']) ?? null,
        currency,
        unit_amount: int(price['unit_amount'], `line_items[${i}][price_data][unit_amount]`),
        quantity: int(item['quantity'] ?? '1', `line_items[${i}][quantity]`),
      };
    });
    if (items.length === 0) throw new StripeApiError(400, 'Missing required param: line_items.', 'line_items');
    if (new Set(items.map((i) => i.currency)).size > 1) throw new StripeApiError(400, 'All line items must share one currency', 'line_items');
    const amount = items.reduce((sum, i) => sum + i.unit_amount * i.quantity, 0);
    const sessionId = id('cs');
    const created = now();
    const session: FakeCheckoutSession = {
      id: sessionId,
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_subtotal: amount,
      amount_total: amount,
      currency: items[0].currency,
      client_reference_id: str(b['client_reference_id']) ?? null,
      customer_email: str(b['customer_email']) ?? null,
      customer_details: null,
      metadata: record(b['metadata']),
      line_items_summary: items.map(({ name, description, unit_amount, quantity }) => ({ name, description, unit_amount, quantity })),
      payment_intent: null,
      success_url: successUrl,
      cancel_url: str(b['cancel_url']) ?? null,
      url: `${baseUrl}/checkout/${sessionId}`,
      created,
      expires_at: created + 24 * 3600,
      livemode: false,
    };
    sessions.set(sessionId, session);
    res.json(session);
  });

  api.get('/checkout/sessions/:id', (req, res) => {
    res.json(sessionOr404(req.params.id));
  });

  api.post('/checkout/sessions/:id/expire', async (req, res) => {
    const s = sessionOr404(req.params.id);
    if (s.status !== 'open') throw new StripeApiError(400, `Only open sessions can be expired; this one is ${s.status}`);
    s.status = 'expired';
    s.url = null;
    await emit('checkout.session.expired', s);
    res.json(s);
  });

  api.post('/refunds', async (req, res) => {
    const b = req.body as Record<string, unknown>;
    const byIntent = str(b['payment_intent']);
    const byCharge = str(b['charge']);
    const charge = byCharge ? charges.get(byCharge) : [...charges.values()].find((c) => c.payment_intent === byIntent);
    if (!charge) throw new StripeApiError(404, `No such payment_intent: '${byIntent ?? byCharge ?? ''}'`, byCharge ? 'charge' : 'payment_intent');
    const left = charge.amount - charge.amount_refunded;
    const amount = b['amount'] === undefined ? left : int(b['amount'], 'amount');
    if (left <= 0) throw new StripeApiError(400, `Charge ${charge.id} has already been refunded.`, undefined, 'invalid_request_error');
    if (amount <= 0 || amount > left) throw new StripeApiError(400, `Refund amount (${amount}) is greater than unrefunded amount on charge (${left})`, 'amount');
    const refund: FakeRefund = {
      id: id('re'),
      object: 'refund',
      amount,
      charge: charge.id,
      currency: charge.currency,
      payment_intent: charge.payment_intent,
      status: 'succeeded',
      reason: str(b['reason']) ?? null,
      metadata: record(b['metadata']),
      created: now(),
    };
    refunds.set(refund.id, refund);
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded === charge.amount;
    res.json(refund);
    // The event follows the answer, as it does at the real service.
    setImmediate(() => void emit('charge.refunded', { ...charge, refunds: { object: 'list', data: [refund] } }));
  });

  api.get('/refunds/:id', (req, res) => {
    const r = refunds.get(req.params.id);
    if (!r) throw new StripeApiError(404, `No such refund: '${req.params.id}'`, 'id');
    res.json(r);
  });

  api.use((req) => {
    throw new StripeApiError(404, `Unrecognized request URL (${req.method}: ${req.originalUrl}).`);
  });
  app.use('/v1', api);

  // --- The hosted checkout page, for the buyer's browser.
  app.get('/checkout/:id', (req, res) => {
    const s = sessions.get(req.params.id);
    res.setHeader('cache-control', 'no-store');
    if (!s) {
      res.status(404).type('html').send(page('Checkout not found', '<p>This checkout link is not known here.</p>'));
      return;
    }
    if (s.status !== 'open') {
      res.status(410).type('html').send(page('Checkout closed', `<p>This checkout is ${escapeHtml(s.status)}.</p>`));
      return;
    }
    const rows = s.line_items_summary
      .map(
        (i) =>
          `<tr><td><strong>${escapeHtml(i.name)}</strong>${i.description ? `<br><small>${escapeHtml(i.description)}</small>` : ''}</td>` +
          `<td class="n">${i.quantity} × ${escapeHtml(money(i.unit_amount, s.currency))}</td></tr>`,
      )
      .join('');
    res.type('html').send(
      page(
        'Confirm your payment',
        `<p class="note">Local test checkout: no card is charged and no details are asked for.</p>
         <table>${rows}<tr class="total"><td>Total</td><td class="n" data-testid="total">${escapeHtml(money(s.amount_total, s.currency))}</td></tr></table>
         ${s.customer_email ? `<p>Receipt to <strong>${escapeHtml(s.customer_email)}</strong></p>` : ''}
         <form method="post" action="/checkout/${encodeURIComponent(s.id)}/pay"><button type="submit" class="pay">Pay ${escapeHtml(money(s.amount_total, s.currency))}</button></form>
         ${s.cancel_url ? `<form method="post" action="/checkout/${encodeURIComponent(s.id)}/cancel"><button type="submit" class="cancel">Cancel and go back</button></form>` : ''}`,
      ),
    );
  });

  app.post('/checkout/:id/pay', async (req, res) => {
    const s = await pay(req.params.id);
    res.redirect(303, s.success_url.replaceAll('{CHECKOUT_SESSION_ID}', s.id));
  });

  app.post('/checkout/:id/cancel', (req, res) => {
    const s = sessionOr404(req.params.id);
    res.redirect(303, s.cancel_url ?? s.success_url.replaceAll('{CHECKOUT_SESSION_ID}', s.id));
  });

  // --- Inspection, for tests and developers.
  app.get('/_fake/health', (_req, res) => {
    res.json({ ok: true, sessions: sessions.size, events: events.length });
  });
  app.get('/_fake/events', (_req, res) => {
    res.json(events);
  });

  app.use((err: unknown, _req: Request, res: Response, next: NextFunction) => {
    void next;
    const e = err instanceof StripeApiError ? err : new StripeApiError(500, 'Fake server error', undefined, 'api_error');
    const status = (err as { status?: unknown }).status;
    if (!(err instanceof StripeApiError) && typeof status === 'number' && status < 500) {
      res.status(status).json({ error: { type: 'invalid_request_error', message: 'Malformed request' } });
      return;
    }
    res.status(e.status).json({ error: { type: e.type, message: e.message, ...(e.param ? { param: e.param } : {}) } });
  });

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port ?? 12111, host, () => resolve(s));
    s.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  baseUrl = (options.publicUrl ?? `http://${host}:${port}`).replace(/\/+$/, '');

  return {
    host,
    port,
    url: baseUrl,
    sessions,
    events,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    pay,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)} · test checkout</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>
  body { font-family: system-ui, sans-serif; background: #eef1f4; color: #1d2430; margin: 0; }
  main { max-width: 440px; margin: 48px auto; background: #fff; border-radius: 10px; padding: 24px 28px; box-shadow: 0 2px 10px #0002; }
  h1 { font-size: 1.3rem; margin-top: 0; }
  .note { background: #fff6d6; border: 1px solid #e5d38a; padding: 8px 10px; border-radius: 6px; font-size: 0.9rem; }
  table { width: 100%; border-collapse: collapse; margin: 16px 0; }
  td { padding: 8px 0; border-bottom: 1px solid #dde2e8; vertical-align: top; }
  .n { text-align: right; white-space: nowrap; }
  .total td { font-weight: 600; border-bottom: none; }
  button { width: 100%; padding: 12px; font-size: 1rem; border-radius: 6px; border: 1px solid #2d4a6b; cursor: pointer; margin-top: 8px; }
  .pay { background: #2d4a6b; color: #fff; }
  .cancel { background: #fff; color: #2d4a6b; }
</style></head><body><main><h1>${escapeHtml(title)}</h1>${body}</main></body></html>`;
}

const isMain = process.argv[1]?.endsWith('fake-stripe-server.ts');
if (isMain) {
  const env = process.env;
  const port = env['FAKE_STRIPE_PORT'] && /^\d+$/.test(env['FAKE_STRIPE_PORT']) ? Number(env['FAKE_STRIPE_PORT']) : 12111;
  startFakeStripeServer({
    host: env['FAKE_STRIPE_HOST'] ?? '127.0.0.1',
    port,
    publicUrl: env['FAKE_STRIPE_PUBLIC_URL'],
    webhookUrl: env['FAKE_STRIPE_WEBHOOK_URL'] ?? 'http://127.0.0.1:4200/api/shop/webhook',
    webhookSecret: env['STRIPE_WEBHOOK_SECRET'] ?? 'whsec_seamwright_local_fake',
    apiKey: env['STRIPE_SECRET_KEY'],
  })
    .then((s) => {
      console.log(`Fake payment provider on ${s.url} (API ${s.url}/v1, events to ${env['FAKE_STRIPE_WEBHOOK_URL'] ?? 'http://127.0.0.1:4200/api/shop/webhook'})`);
      const stop = () => void s.close().then(() => process.exit(0));
      process.once('SIGINT', stop);
      process.once('SIGTERM', stop);
    })
    .catch((err) => {
      console.error('Fake payment provider failed to start:', err);
      process.exit(1);
    });
}
