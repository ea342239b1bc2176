import { expect, test, type APIRequestContext, type Page } from '@playwright/test';
import { baseURL, fakeStripeURL } from '../playwright.config';
import { sampleBlock } from '../tests/fixtures/documents';
import { mailsTo } from './pages/mail-inbox';

/*
 * The pattern shop against the real server, the local fake mail server and the local fake payment
 * provider (see playwright.config.ts): a designer publishes one pattern and keeps another as a draft;
 * a quilter cannot reach either before paying, buys one on the provider's hosted checkout page, gets
 * quilter access and a receipt e-mail; a replayed and a forged webhook change nothing; the designer
 * refunds and the access ends. Every screen is saved under e2e/artifacts/ to be looked at.
 */

const run = Date.now().toString(36);
const designer = { name: 'Wren Designer', email: `wren-${run}@example.test`, password: 'lantern-block-1' };
const quilter = { name: 'Ivy Quilter', email: `ivy-${run}@example.test`, password: 'plum-and-oat-22' };

const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/shop-${name}.png`, fullPage: true });

interface DeliveredEvent {
  id: string;
  type: string;
  payload: string;
  signature: string;
  attempts: number[];
}

async function deliveredEvents(): Promise<DeliveredEvent[]> {
  return (await (await fetch(`${fakeStripeURL}/_fake/events`)).json()) as DeliveredEvent[];
}

async function signUp(page: Page, user: { name: string; email: string; password: string }, role: 'designer' | 'quilter') {
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill(user.name);
  await page.getByLabel('E-mail').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(user.password);
  await page.getByLabel('Password again').fill(user.password);
  await page.getByRole('radio', { name: role === 'designer' ? /design patterns/ : /sew patterns/ }).check();
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('button', { name: 'Account menu' })).toBeVisible();
}

/** Creates an 8 in. sample block through the API as the signed-in user of `request` (patterns are not the shop's screens). */
async function createPattern(request: APIRequestContext, title: string): Promise<string> {
  const { csrfToken } = await (await request.get('/api/auth/csrf')).json();
  const document = sampleBlock(title, 8);
  const res = await request.post('/api/patterns', { data: { document }, headers: { 'X-CSRF-Token': csrfToken } });
  expect(res.status()).toBe(201);
  return (await res.json()).pattern.id as string;
}

test.describe.configure({ mode: 'serial' });

test('a designer publishes, a quilter pays on the checkout page and gets access and a receipt; replayed and forged webhooks change nothing; a refund ends the access', async ({ browser }) => {
  test.setTimeout(180_000);
  const designerCtx = await browser.newContext({ viewport: { width: 1366, height: 900 } });
  const d = await designerCtx.newPage();
  await signUp(d, designer, 'designer');
  const listedId = await createPattern(d.request, 'Lantern Block');
  const draftId = await createPattern(d.request, 'Unfinished Star');

  // --- Publish settings: the shop's currency, then a price in minor units and a description.
  await d.getByRole('link', { name: 'Shop' }).click();
  await d.getByRole('tab', { name: /Publish/ }).click();
  await expect(d.getByText('Taxes are out of scope')).toBeVisible();
  await expect(d.getByText('Save a currency first')).toBeVisible();
  await shot(d, 'publish-empty');
  await d.getByRole('combobox', { name: 'Currency' }).click();
  await d.getByRole('option', { name: /EUR — Euro/ }).click();
  await d.getByRole('button', { name: 'Save currency' }).click();
  await expect(d.getByText('Your shop sells in EUR')).toBeVisible();

  const lantern = d.getByRole('form', { name: 'Listing of Lantern Block' });
  await lantern.getByLabel(/Price in EUR/).fill('12.505');
  await lantern.getByLabel('Description for buyers').fill('An 8 in. block: one section, two patches, sewn in a single evening.');
  await lantern.getByRole('button', { name: 'Save listing' }).click();
  await expect(lantern.getByText('Type an amount with at most 2 decimals, e.g. 12.50')).toBeVisible();
  await shot(d, 'publish-price-error');
  await lantern.getByLabel(/Price in EUR/).fill('12.50');
  await expect(lantern.getByText('Buyers pay €12.50')).toBeVisible();
  await lantern.getByRole('switch', { name: 'Published' }).click();
  await lantern.getByRole('button', { name: 'Save listing' }).click();
  await expect(d.getByText('“Lantern Block” is in the shop at €12.50')).toBeVisible();

  const star = d.getByRole('form', { name: 'Listing of Unfinished Star' });
  await star.getByLabel(/Price in EUR/).fill('9');
  await star.getByLabel('Description for buyers').fill('Still being drafted.');
  await star.getByRole('button', { name: 'Save listing' }).click();
  await expect(d.getByText('“Unfinished Star” saved, not published')).toBeVisible();
  await shot(d, 'publish');
  await d.getByRole('button', { name: 'Use dark theme' }).click();
  await shot(d, 'publish-dark');
  await d.getByRole('button', { name: 'Use light theme' }).click();

  // --- The quilter: the shop lists only the published pattern; nothing unpaid or unpublished is reachable.
  const quilterCtx = await browser.newContext({ viewport: { width: 1280, height: 860 } });
  const q = await quilterCtx.newPage();
  await signUp(q, quilter, 'quilter');
  await q.getByRole('link', { name: 'Shop' }).click();
  const cards = q.getByRole('list', { name: 'Patterns for sale' }).getByRole('listitem');
  await expect(cards.filter({ hasText: 'Lantern Block' })).toContainText('€12.50');
  // The card shows the design's picture (drawn by the server when the listing was saved) and its finished size.
  await expect(cards.filter({ hasText: 'Lantern Block' }).getByRole('img', { name: 'Picture of the design Lantern Block' })).toBeVisible();
  await expect(cards.filter({ hasText: 'Lantern Block' })).toContainText('8 in. × 8 in. finished');
  await expect(cards.filter({ hasText: 'Unfinished Star' })).toHaveCount(0);
  await expect(q.getByRole('tab', { name: /Publish/ })).toHaveCount(0);
  await shot(q, 'browse');

  expect((await q.request.get(`/api/shop/listings/${draftId}`)).status()).toBe(404);
  expect((await q.request.get(`/api/patterns/${draftId}`)).status()).toBe(404);
  expect((await q.request.get(`/api/patterns/${listedId}`)).status()).toBe(404);
  await q.goto(`/shop/patterns/${draftId}`);
  await expect(q.getByRole('heading', { name: 'Not found' })).toBeVisible();
  await q.goto(`/patterns/${listedId}`);
  await expect(q.getByRole('heading', { name: 'Not found' })).toBeVisible();
  await shot(q, 'unpaid-not-found');

  // --- Buy: the pattern page, then the provider's hosted checkout page, then back.
  await q.goto('/shop');
  await q.getByRole('link', { name: 'View Lantern Block' }).click();
  await expect(q.getByRole('heading', { name: 'Lantern Block' })).toBeVisible();
  await expect(q.getByText('1 section · 8 in. × 8 in. finished', { exact: false })).toBeVisible();
  await shot(q, 'detail');
  await q.setViewportSize({ width: 820, height: 1180 });
  await shot(q, 'detail-tablet');
  await q.goto('/shop');
  await expect(cards.filter({ hasText: 'Lantern Block' })).toBeVisible();
  await shot(q, 'browse-tablet');
  await q.getByRole('link', { name: 'View Lantern Block' }).click();
  await q.setViewportSize({ width: 1280, height: 860 });
  // First the buyer changes their mind on the checkout page; nothing is charged.
  await q.getByRole('button', { name: 'Buy for €12.50' }).click();
  await q.waitForURL(`${fakeStripeURL}/checkout/**`);
  const firstCheckout = q.url();
  await q.getByRole('button', { name: 'Cancel and go back' }).click();
  await q.waitForURL(new RegExp(`/shop/patterns/${listedId}\\?cancelled=1$`));
  await expect(q.getByText('Checkout was cancelled; nothing was charged.')).toBeVisible();
  await shot(q, 'detail-cancelled');
  // Buying again offers the same open checkout, so one purchase can never be paid twice.
  await q.getByRole('button', { name: 'Buy for €12.50' }).click();
  await q.waitForURL(`${fakeStripeURL}/checkout/**`);
  expect(q.url()).toBe(firstCheckout);
  await expect(q.getByRole('heading', { name: 'Confirm your payment' })).toBeVisible();
  await expect(q.getByTestId('total')).toHaveText('€12.50');
  await expect(q.getByText(quilter.email)).toBeVisible();
  // Still unpaid: no access yet.
  expect((await q.request.get(`${baseURL}/api/patterns/${listedId}`)).status()).toBe(404);
  await shot(q, 'checkout-page');
  await q.getByRole('button', { name: 'Pay €12.50' }).click();

  await q.waitForURL(/\/shop\/purchases\?order=/);
  await expect(q.getByText('Payment received: “Lantern Block” is in your patterns')).toBeVisible();
  await expect(q.getByRole('table', { name: 'Your purchases' }).getByRole('row').filter({ hasText: 'Lantern Block' })).toContainText('Paid');
  await shot(q, 'purchases-paid');
  await q.getByRole('link', { name: 'Open the pattern' }).click();
  await expect(q.getByRole('heading', { name: 'Lantern Block', level: 1 })).toBeVisible();
  await expect(q.getByText(/Quilter/).first()).toBeVisible();
  await q.getByRole('tab', { name: /Sewing log/ }).click();
  await expect(q).toHaveURL(new RegExp(`/patterns/${listedId}/sewing-log$`));
  await shot(q, 'bought-pattern-sewing-log');
  const access = await (await q.request.get(`/api/patterns/${listedId}`)).json();
  expect(access.pattern.access).toBe('quilter');

  // --- The receipt, read from the fake mail server's HTTP API.
  await expect.poll(async () => (await mailsTo(quilter.email)).filter((m) => /receipt/.test(m.subject)).length, { timeout: 15_000 }).toBe(1);
  const receipt = (await mailsTo(quilter.email)).find((m) => /receipt/.test(m.subject))!;
  expect(receipt.subject).toBe('Your receipt for "Lantern Block"');
  expect(receipt.text).toContain('Amount paid: €12.50 (EUR)');
  expect(receipt.text).toContain(`${baseURL}/patterns/${listedId}`);
  expect(receipt.text).toContain('does not calculate or collect taxes');

  // --- A replayed event is acknowledged and changes nothing; a forged one is refused.
  const completed = (await deliveredEvents()).filter((e) => e.type === 'checkout.session.completed');
  expect(completed).toHaveLength(1);
  expect(completed[0].attempts).toEqual([200]);
  const purchasesBefore = await (await q.request.get('/api/shop/purchases')).json();
  const replay = await fetch(`${baseURL}/api/shop/webhook`, {
    method: 'POST',
    headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': completed[0].signature },
    body: completed[0].payload,
  });
  expect(replay.status).toBe(200);
  expect(await replay.json()).toEqual({ received: true, duplicate: true });
  const forgedEvent = JSON.parse(completed[0].payload);
  forgedEvent.id = `${forgedEvent.id}x`;
  const forged = await fetch(`${baseURL}/api/shop/webhook`, {
    method: 'POST',
    headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': completed[0].signature },
    body: JSON.stringify(forgedEvent),
  });
  expect(forged.status).toBe(400);
  expect((await forged.json()).error).toBe('Webhook signature verification failed');
  expect(await (await q.request.get('/api/shop/purchases')).json()).toEqual(purchasesBefore);
  expect((await mailsTo(quilter.email)).filter((m) => /receipt/.test(m.subject))).toHaveLength(1);

  // --- The designer's sales, and a refund through the provider.
  await d.getByRole('tab', { name: /Sales/ }).click();
  const sale = d.getByRole('table', { name: 'Sales' }).getByRole('row').filter({ hasText: quilter.email });
  await expect(sale).toContainText('€12.50');
  await expect(sale).toContainText('Paid');
  await expect(d.getByLabel('Totals')).toContainText('€12.50');
  await shot(d, 'sales');
  d.once('dialog', (dialog) => void dialog.accept());
  await sale.getByRole('button', { name: /^Refund/ }).click();
  await expect(sale).toContainText('Refunded', { timeout: 20_000 });
  await shot(d, 'sales-refunded');
  expect((await deliveredEvents()).map((e) => e.type)).toEqual(['checkout.session.completed', 'charge.refunded']);

  // --- Refunded: the quilter's access is gone.
  expect((await q.request.get(`/api/patterns/${listedId}`)).status()).toBe(404);
  await q.goto(`/patterns/${listedId}`);
  await expect(q.getByRole('heading', { name: 'Not found' })).toBeVisible();
  await q.goto('/shop/purchases');
  await expect(q.getByRole('table', { name: 'Your purchases' }).getByRole('row').filter({ hasText: 'Lantern Block' })).toContainText('Refunded');
  await shot(q, 'purchases-refunded');

  await designerCtx.close();
  await quilterCtx.close();
});
