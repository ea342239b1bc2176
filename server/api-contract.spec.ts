/*
 * The server's answers against the shared API contract (@seamwright/api; docs/api.md): a realistic run
 * of requests over every route, each answer parsed with the schema the app's types come from. The
 * schemas are strict, so a field added, dropped, renamed or retyped on either side fails here.
 */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import type { Response } from 'superagent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  checkoutAnswerSchema,
  csrfAnswerSchema,
  devInboxAnswerSchema,
  errorAnswerSchema,
  healthAnswerSchema,
  invitationAnswerSchema,
  invitationPreviewAnswerSchema,
  listingAnswerSchema,
  listingPageSchema,
  memberChangeAnswerSchema,
  membersAnswerSchema,
  myShopSchema,
  okAnswerSchema,
  orderAnswerSchema,
  patternAnswerSchema,
  patternPageSchema,
  patternWithRevisionSchema,
  printSetAnswerSchema,
  printSetListAnswerSchema,
  printSetSchema,
  purchasePageSchema,
  revisionAnswerSchema,
  revisionGroupPageSchema,
  revisionPageSchema,
  salesPageSchema,
  sessionAnswerSchema,
  sewingLogAnswerSchema,
  sewingLogEntryAnswerSchema,
  shopAnswerSchema,
  signedInAnswerSchema,
  staleSaveDetailsSchema,
  uploadAnswerSchema,
  uploadListAnswerSchema,
  userAnswerSchema,
  userPageSchema,
  colourwayCopyAnswerSchema,
  colourwayCopyListAnswerSchema,
  staleCopyDetailsSchema,
} from '@seamwright/api';
import { parsePatternDocument } from '@seamwright/piecing';
import { startFakeStripeServer, type FakeStripeServer } from './dev/fake-stripe-server';
import { Client, TINY_PNG, sampleDocument, startTestServer, tokenFromMail, userClient, type TestServer } from './test/harness';

const SK = 'sk_test_contract_key';
const WHSEC = 'whsec_contract_secret';

let fake: FakeStripeServer;
let t: TestServer;
let listening: Server;

/** Every schema an answer was checked against, to show the run covers the whole contract. */
const checked = new Set<z.ZodType>();

/** Asserts the status, then parses the body with `schema`; a mismatch names the request and the paths. */
function answer<T extends z.ZodType>(res: Response, status: number, schema: T): z.infer<T> {
  // superagent's response keeps its request (the typings leave it out).
  const { method, path } = (res as unknown as { req: { method: string; path: string } }).req;
  const what = `${method} ${path}`;
  expect(res.status, `${what}: ${JSON.stringify(res.body)}`).toBe(status);
  const parsed = schema.safeParse(res.body);
  if (!parsed.success) {
    throw new Error(`${what} does not match the contract:\n${parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n')}`);
  }
  checked.add(schema);
  return parsed.data;
}

/** Reads a text/event-stream answer to its end. */
const streamText = (r: Response, cb: (err: Error | null, body: string) => void) => {
  let text = '';
  r.setEncoding('utf8');
  r.on('data', (c: string) => (text += c));
  r.on('end', () => cb(null, text));
};

beforeAll(async () => {
  fake = await startFakeStripeServer({ port: 0, webhookSecret: WHSEC, apiKey: SK, retries: 0 });
  t = await startTestServer({ STRIPE_SECRET_KEY: SK, STRIPE_WEBHOOK_SECRET: WHSEC, STRIPE_API_BASE: fake.url });
  listening = await new Promise<Server>((resolve) => {
    const s = t.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  fake.setWebhookUrl(`http://127.0.0.1:${(listening.address() as AddressInfo).port}/api/shop/webhook`);
});

afterAll(async () => {
  await new Promise<void>((r) => listening.close(() => r()));
  await t.close();
  await fake.close();
});

describe('answers match the shared API contract', () => {
  it('accounts, patterns, revisions, sharing, sewing log, uploads, print sets, admin and shop', async () => {
    const anon = await Client.create(t.app);
    answer(await anon.get('/api/health'), 200, healthAnswerSchema);
    answer(await anon.get('/api/auth/csrf'), 200, csrfAnswerSchema);
    answer(await anon.get('/api/auth/session'), 200, sessionAnswerSchema);
    answer(await anon.get('/api/auth/me'), 401, errorAnswerSchema);

    // Accounts.
    const owner = await Client.create(t.app);
    const signedUp = answer(
      await owner.post('/api/auth/sign-up', { email: 'olive@contract.test', password: 'correct horse battery', displayName: 'Olive', role: 'designer' }),
      201,
      signedInAnswerSchema,
    );
    owner.csrfToken = signedUp.csrfToken;
    owner.user = signedUp.user;
    answer(await owner.get('/api/auth/me'), 200, userAnswerSchema);
    expect(answer(await owner.get('/api/auth/session'), 200, sessionAnswerSchema).user?.email).toBe('olive@contract.test');
    answer(await owner.post('/api/auth/change-password', { currentPassword: 'correct horse battery', newPassword: 'correct horse battery 2' }), 200, okAnswerSchema);
    owner.csrfToken = answer(await owner.post('/api/auth/sign-out'), 200, csrfAnswerSchema).csrfToken;
    const signedIn = answer(await owner.post('/api/auth/sign-in', { email: 'olive@contract.test', password: 'correct horse battery 2' }), 200, signedInAnswerSchema);
    owner.csrfToken = signedIn.csrfToken;
    answer(await anon.post('/api/auth/password-reset', { email: 'olive@contract.test' }), 202, okAnswerSchema);

    // Patterns and revisions.
    const created = answer(await owner.post('/api/patterns', { document: sampleDocument('Contract block') }), 201, patternWithRevisionSchema);
    const id = created.pattern.id;
    expect(parsePatternDocument(created.revision.document).ok).toBe(true);
    answer(await owner.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Contract block'), editSession: 'contract-session-1' }), 200, patternWithRevisionSchema);
    const stale = answer(await owner.put(`/api/patterns/${id}`, { baseRevision: 1, document: sampleDocument('Contract block') }), 409, errorAnswerSchema);
    staleSaveDetailsSchema.parse(stale.details);
    checked.add(staleSaveDetailsSchema);
    answer(await owner.get(`/api/patterns/${id}`), 200, patternWithRevisionSchema);
    const list = answer(await owner.get('/api/patterns'), 200, patternPageSchema);
    expect(list.items[0]).toMatchObject({ id, sectionCount: 1 });
    expect(list.items[0].preview).not.toBeNull();
    answer(await owner.post(`/api/patterns/${id}/revisions`, { baseRevision: 2, name: 'First cut', note: 'for testing' }), 201, patternWithRevisionSchema);
    answer(await owner.post(`/api/patterns/${id}/revisions/1/restore`, { baseRevision: 3 }), 201, patternWithRevisionSchema);
    const revisions = answer(await owner.get(`/api/patterns/${id}/revisions`), 200, revisionPageSchema);
    expect(revisions.items.map((r) => [r.number, r.version?.name ?? null, r.restoredFrom])).toEqual([
      [4, null, 1],
      [3, 'First cut', null],
      [2, null, null],
      [1, null, null],
    ]);
    answer(await owner.get(`/api/patterns/${id}/revisions/groups`), 200, revisionGroupPageSchema);
    answer(await owner.get(`/api/patterns/${id}/revisions/3`), 200, revisionAnswerSchema);
    const copy = answer(await owner.post(`/api/patterns/${id}/duplicate`, { title: 'Contract copy' }), 201, patternWithRevisionSchema);
    answer(await owner.post(`/api/patterns/${copy.pattern.id}/trash`), 200, patternAnswerSchema);
    answer(await owner.get('/api/patterns?scope=trash'), 200, patternPageSchema);
    answer(await owner.post(`/api/patterns/${copy.pattern.id}/restore`), 200, patternAnswerSchema);

    // Sharing.
    const quilter = await userClient(t.app, 'quinn@contract.test', 'quilter');
    const arrives = t.mail.waitFor('quinn@contract.test');
    answer(await owner.post(`/api/patterns/${id}/invitations`, { email: 'quinn@contract.test', access: 'co-designer' }), 201, invitationAnswerSchema);
    const { token } = tokenFromMail((await arrives).text);
    answer(await anon.get(`/api/invitations/${token}`), 200, invitationPreviewAnswerSchema);
    answer(await quilter.post('/api/invitations/accept', { token }), 200, patternAnswerSchema);
    const pending = t.mail.waitFor('other@contract.test');
    answer(await owner.post(`/api/patterns/${id}/invitations`, { email: 'other@contract.test', access: 'quilter' }), 201, invitationAnswerSchema);
    await pending;
    const members = answer(await owner.get(`/api/patterns/${id}/members`), 200, membersAnswerSchema);
    expect([members.members.length, members.invitations.length]).toEqual([1, 1]);
    answer(await quilter.get(`/api/patterns/${id}/members`), 200, membersAnswerSchema);
    answer(await owner.patch(`/api/patterns/${id}/members/${quilter.user!.id}`, { access: 'quilter' }), 200, memberChangeAnswerSchema);

    // Sewing log.
    const sectionId = sampleDocument().sections[0].id;
    answer(await quilter.put(`/api/patterns/${id}/sewing-log/${sectionId}`, { stage: 'pieced' }), 200, sewingLogEntryAnswerSchema);
    answer(await quilter.get(`/api/patterns/${id}/sewing-log`), 200, sewingLogAnswerSchema);
    expect(answer(await quilter.put(`/api/patterns/${id}/sewing-log/${sectionId}`, { stage: null }), 200, sewingLogEntryAnswerSchema).entry).toBeNull();

    // Colourway copies: the quilter's own, saved on top of a version.
    const own = answer(await quilter.post(`/api/patterns/${id}/colourway-copies`, { colourwayId: null }), 201, colourwayCopyAnswerSchema).copy;
    answer(await quilter.patch(`/api/patterns/${id}/colourway-copies/${own.id}`, { version: 1, name: 'My own' }), 200, colourwayCopyAnswerSchema);
    const staleCopy = answer(await quilter.patch(`/api/patterns/${id}/colourway-copies/${own.id}`, { version: 1, name: 'Late' }), 409, errorAnswerSchema);
    staleCopyDetailsSchema.parse(staleCopy.details);
    checked.add(staleCopyDetailsSchema);
    answer(await quilter.get(`/api/patterns/${id}/colourway-copies/${own.id}`), 200, colourwayCopyAnswerSchema);
    expect(answer(await quilter.get(`/api/patterns/${id}/colourway-copies`), 200, colourwayCopyListAnswerSchema).items).toHaveLength(1);

    // Uploads.
    const upload = owner.req('post', `/api/patterns/${id}/uploads`).attach('file', TINY_PNG, { filename: 'ref.png', contentType: 'image/png' });
    answer(await upload, 201, uploadAnswerSchema);
    answer(await owner.get(`/api/patterns/${id}/uploads`), 200, uploadListAnswerSchema);

    // Print sets: queued, done, listed and streamed.
    const made = answer(await quilter.post(`/api/patterns/${id}/print-sets`, { options: { paper: 'letter' } }), 202, printSetAnswerSchema);
    const stream = await quilter.get(`/api/patterns/${id}/print-sets/${made.printSet.id}/events`).buffer(true).parse(streamText);
    const events = String(stream.body)
      .split('\n\n')
      .filter((e) => e.startsWith('event: progress'))
      .map((e) => printSetSchema.parse(JSON.parse(e.split('\ndata: ')[1])));
    expect(events.at(-1)?.status).toBe('done');
    const done = answer(await quilter.get(`/api/patterns/${id}/print-sets/${made.printSet.id}`), 200, printSetAnswerSchema).printSet;
    expect(done.templateSheets).toBeGreaterThanOrEqual(1);
    answer(await quilter.get(`/api/patterns/${id}/print-sets`), 200, printSetListAnswerSchema);

    // Admin.
    const { users } = t.ctx.data.t;
    await t.ctx.data.db.update(users).set({ role: 'admin' }).where(eq(users.email, 'olive@contract.test'));
    answer(await owner.get('/api/admin/users?q=contract'), 200, userPageSchema);
    answer(await owner.patch(`/api/admin/users/${quilter.user!.id}`, { disabled: false }), 200, userAnswerSchema);
    const inbox = answer(await owner.get('/api/admin/dev-inbox'), 200, devInboxAnswerSchema);
    expect(inbox.messages.length).toBeGreaterThanOrEqual(3);

    // Shop: a currency, a listing, a purchase paid through the provider's fake, the sale and a refund.
    answer(await owner.get('/api/shop/mine'), 200, myShopSchema);
    answer(await owner.put('/api/shop/mine', { currency: 'jpy' }), 200, shopAnswerSchema);
    answer(await owner.put(`/api/shop/listings/${copy.pattern.id}`, { priceMinor: 1500, description: 'A contract pattern', published: true }), 200, listingAnswerSchema);
    answer(await owner.get('/api/shop/mine'), 200, myShopSchema);
    const buyer = await userClient(t.app, 'bea@contract.test', 'quilter');
    answer(await buyer.get('/api/shop/listings'), 200, listingPageSchema);
    answer(await buyer.get(`/api/shop/listings/${copy.pattern.id}`), 200, listingAnswerSchema);
    const checkout = answer(await buyer.post(`/api/shop/listings/${copy.pattern.id}/checkout`), 201, checkoutAnswerSchema);
    answer(await buyer.post(`/api/shop/listings/${copy.pattern.id}/checkout`), 200, checkoutAnswerSchema);
    const sessionId = checkout.checkoutUrl.split('/').pop();
    expect((await fetch(`${fake.url}/checkout/${sessionId}/pay`, { method: 'POST', redirect: 'manual' })).status).toBe(303);
    expect(answer(await buyer.get(`/api/shop/orders/${checkout.order.id}`), 200, orderAnswerSchema).order.status).toBe('paid');
    answer(await buyer.get('/api/shop/purchases'), 200, purchasePageSchema);
    const sales = answer(await owner.get('/api/shop/sales'), 200, salesPageSchema);
    expect(sales.totals).toEqual([{ currency: 'jpy', orders: 1, amountMinor: 1500 }]);
    answer(await owner.post(`/api/shop/sales/${checkout.order.id}/refund`), 202, orderAnswerSchema);

    // Errors have one shape everywhere.
    answer(await anon.get(`/api/patterns/${id}`), 404, errorAnswerSchema);
    answer(await owner.put(`/api/patterns/${id}`, { baseRevision: 'x' }), 400, errorAnswerSchema);
  });

  it('checked every answer schema the contract offers', () => {
    const offered = [
      checkoutAnswerSchema, colourwayCopyAnswerSchema, colourwayCopyListAnswerSchema, staleCopyDetailsSchema, csrfAnswerSchema, devInboxAnswerSchema, errorAnswerSchema, healthAnswerSchema, invitationAnswerSchema,
      invitationPreviewAnswerSchema, listingAnswerSchema, listingPageSchema, memberChangeAnswerSchema, membersAnswerSchema, myShopSchema,
      okAnswerSchema, orderAnswerSchema, patternAnswerSchema, patternPageSchema, patternWithRevisionSchema, printSetAnswerSchema,
      printSetListAnswerSchema, purchasePageSchema, revisionAnswerSchema, revisionGroupPageSchema, revisionPageSchema, salesPageSchema,
      sessionAnswerSchema, sewingLogAnswerSchema, sewingLogEntryAnswerSchema, shopAnswerSchema, signedInAnswerSchema, staleSaveDetailsSchema,
      uploadAnswerSchema, uploadListAnswerSchema, userAnswerSchema, userPageSchema,
    ];
    expect(offered.filter((s) => !checked.has(s))).toEqual([]);
  });
});
