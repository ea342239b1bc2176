import { expect, test } from '@playwright/test';
import { readFileSync } from 'node:fs';

const version = (JSON.parse(readFileSync('package.json', 'utf8')) as { version: string }).version;

test('the server answers its health check with the package version', async ({ request }) => {
  const res = await request.get('/api/health');
  expect(res.status()).toBe(200);
  expect(await res.json()).toEqual({ ok: true, version });
});

test('the home page loads with the shipped fonts and makes no request to another host', async ({ page, baseURL }) => {
  const foreign: string[] = [];
  const failed: string[] = [];
  const consoleErrors: string[] = [];
  page.on('request', (r) => {
    if (!r.url().startsWith(baseURL!) && !r.url().startsWith('data:') && !r.url().startsWith('blob:')) foreign.push(r.url());
  });
  page.on('requestfailed', (r) => failed.push(r.url()));
  page.on('console', (m) => {
    if (m.type() === 'error') consoleErrors.push(m.text());
  });
  await page.goto('/');
  await expect(page.getByRole('link', { name: /seamwright/i }).first()).toBeVisible();
  await page.evaluate(() => document.fonts.ready);
  const fonts = await page.evaluate(() => ({
    text: document.fonts.check('16px Roboto'),
    icons: document.fonts.check('24px "Material Symbols Outlined"'),
    loaded: [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family.replace(/"/g, '')),
  }));
  expect(fonts.text).toBe(true);
  expect(fonts.loaded).toContain('Roboto');
  expect(fonts.loaded).toContain('Material Symbols Outlined');
  // An icon ligature renders as one glyph about as wide as it is tall, not as the word spelled out.
  const icon = page.locator('mat-icon').first();
  const box = await icon.boundingBox();
  expect(box).not.toBeNull();
  expect(box!.width).toBeLessThan(40);
  await page.screenshot({ path: 'e2e/artifacts/home.png', fullPage: true });
  expect(foreign).toEqual([]);
  expect(failed).toEqual([]);
  expect(consoleErrors).toEqual([]);
});
