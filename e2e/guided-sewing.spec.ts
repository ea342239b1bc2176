import { expect, test, type Browser, type Page } from '@playwright/test';
import { buildGardenGate } from '../projects/piecing/src/public-api';
import { AuthPage } from './pages/auth.page';
import { GuidedSewingPage } from './pages/guided-sewing.page';
import { SewingLogPage } from './pages/sewing-log.page';
import { linkIn, waitForMail } from './pages/mail-inbox';

/*
 * A quilter walks one section of a shared pattern in guided sewing by keyboard; the sewing log then shows
 * that copy pieced and the progress moved, and a reload comes back to the same step. Garden Gate (the
 * invented demo, docs/design-notes.md#demo-data) has sections A, B, C of 3 patches, made 4 times: 12 copies
 * × 3 stages = 36 steps in the log. Screens go to e2e/artifacts/ to be looked at.
 */

const run = Date.now().toString(36);
/** A designer and a quilter of their own for each test (`tag` keeps the addresses apart). */
const people = (tag: string) => ({
  designer: { name: 'Gale Designer', email: `gale-${tag}-${run}@example.test`, password: 'garden-gate-41', role: 'designer' as const },
  quilter: { name: 'Remy Quilter', email: `remy-${tag}-${run}@example.test`, password: 'moss-brick-cream-7', role: 'quilter' as const },
});

test.use({ actionTimeout: 15_000, navigationTimeout: 60_000 });

async function csrf(page: Page): Promise<Record<string, string>> {
  const { csrfToken } = (await (await page.request.get('/api/auth/csrf')).json()) as { csrfToken: string };
  return { 'x-csrf-token': csrfToken };
}

/** The designer creates Garden Gate and shares it with the quilter, who signs up and accepts. */
async function sharedGardenGate(browser: Browser, tag: string): Promise<{ id: string; page: Page }> {
  const { designer, quilter } = people(tag);
  const designerCtx = await browser.newContext();
  const d = await designerCtx.newPage();
  await new AuthPage(d).signUp(designer);
  await expect(d.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  const created = await d.request.post('/api/patterns', { data: { document: buildGardenGate() }, headers: await csrf(d) });
  expect(created.status()).toBe(201);
  const { pattern } = (await created.json()) as { pattern: { id: string } };
  const invited = await d.request.post(`/api/patterns/${pattern.id}/invitations`, { data: { email: quilter.email, access: 'quilter' }, headers: await csrf(d) });
  expect(invited.status()).toBe(201);
  const token = new URL(linkIn(await waitForMail(quilter.email, /shared/), 'http')).searchParams.get('token');
  await designerCtx.close();

  const quilterCtx = await browser.newContext({ viewport: { width: 820, height: 1180 } });
  const page = await quilterCtx.newPage();
  await new AuthPage(page).signUp(quilter);
  await expect(page.getByRole('button', { name: 'Account menu' })).toBeVisible();
  const accepted = await page.request.post('/api/invitations/accept', { data: { token }, headers: await csrf(page) });
  expect(accepted.status()).toBe(200);
  return { id: pattern.id, page };
}

test('the quilter walks a section in guided sewing and the sewing log shows it', async ({ browser }) => {
  test.setTimeout(120_000);
  const { id, page } = await sharedGardenGate(browser, 'walk');
  const log = new SewingLogPage(page);
  await page.goto(`/patterns/${id}/sewing-log`);
  await expect(log.progress()).toHaveAttribute('aria-valuenow', '0');

  // The pattern's parts link to guided sewing.
  await page.getByRole('tab', { name: /Guided sewing/ }).click();
  await page.waitForURL(new RegExp(`/patterns/${id}/sew$`));
  const guided = new GuidedSewingPage(page);
  await expect(guided.stepHeading()).toHaveText('Step 1 of 4: add B1');
  await expect(guided.instruction('Piece')).toContainText(/Moss, rough cut .+ × .+ in\./);
  await expect(guided.picture()).toHaveAttribute('aria-label', /printed side of the foundation shows it \(mirror image\)/);
  await expect(guided.previousButton()).toBeDisabled();
  await expect(page.getByText(/Keys: → or N next step, ← or P previous step/)).toBeVisible();

  // Every step of section B, copy 1 (the default joining plan joins B to A first), by keys. Focus is still on
  // the tab just clicked, where arrows move between tabs, so N first; then focus lands on each step's heading.
  await guided.press('n');
  await expect(guided.stepHeading()).toHaveText('Step 2 of 4: add B2');
  await expect(guided.stepHeading()).toBeFocused();
  await expect(guided.instruction('Sew')).toContainText('between B1 and B2');
  await expect(guided.instruction('Press')).toContainText('toward B2 (the patch just added)');
  await guided.press('ArrowRight');
  await expect(guided.stepHeading()).toHaveText('Step 3 of 4: add B3');
  await expect(guided.instruction('Pre-trim')).toHaveCount(0);
  // Leaving the last patch ticks copy 1 of B pieced in the log.
  const logged = page.waitForResponse((r) => r.request().method() === 'PUT' && r.url().includes(`/api/patterns/${id}/sewing-log/`));
  await guided.press('ArrowRight');
  expect((await logged).status()).toBe(200);
  await expect(guided.stepHeading()).toHaveText('Step 4 of 4: trim section B');
  await expect(guided.stepHeading()).toBeFocused();
  await expect(page.getByText('Sewing log: Pieced')).toBeVisible();
  await guided.press('ArrowLeft');
  await expect(guided.stepHeading()).toHaveText('Step 3 of 4: add B3');
  await guided.press('p');
  await expect(guided.stepHeading()).toHaveText('Step 2 of 4: add B2');
  await guided.press('n');
  await expect(guided.stepHeading()).toHaveText('Step 3 of 4: add B3');
  await guided.nextButton().click();
  await expect(guided.stepHeading()).toHaveText('Step 4 of 4: trim section B');

  // A reload comes back to the same step.
  await page.reload();
  await expect(guided.stepHeading()).toHaveText('Step 4 of 4: trim section B');
  await expect(page.getByText('Section B · copy 1 of 4')).toBeVisible();

  // The sewing log: copy 1 of B pieced, the others not started; 1 of 36 steps.
  await page.getByRole('tab', { name: /Sewing log/ }).click();
  await page.waitForURL(new RegExp(`/patterns/${id}/sewing-log$`));
  await expect(log.stageOf('B', 'Pieced', 1)).toHaveAttribute('aria-checked', 'true');
  await expect(log.stageOf('B', 'Not started', 2)).toHaveAttribute('aria-checked', 'true');
  await expect(log.progress()).toHaveAttribute('aria-valuetext', '3 %, 1 of 36 steps');
  await page.context().close();
});

test('guided sewing on a phone and a tablet, light and dark', async ({ browser }) => {
  test.setTimeout(300_000);
  const { id, page } = await sharedGardenGate(browser, 'screens');
  const state = await page.context().storageState();
  await page.context().close();
  for (const colorScheme of ['light', 'dark'] as const) {
    for (const [name, viewport] of [['phone', { width: 390, height: 844 }], ['tablet', { width: 820, height: 1180 }]] as const) {
      const ctx = await browser.newContext({ storageState: state, viewport, colorScheme });
      const p = await ctx.newPage();
      const guided = new GuidedSewingPage(p);
      await guided.goto(id);
      await expect(guided.stepHeading()).toHaveText('Step 1 of 4: add B1');
      // The app keeps the theme last chosen; choose the one to look at.
      const other = p.getByRole('button', { name: `Use ${colorScheme} theme` });
      if (await other.isVisible()) await other.click();
      await expect(p.getByRole('button', { name: `Use ${colorScheme === 'dark' ? 'light' : 'dark'} theme` })).toBeVisible();
      await guided.press('ArrowRight');
      await expect(guided.stepHeading()).toHaveText('Step 2 of 4: add B2');
      // Touch targets: the step buttons are at least 44 px high.
      for (const b of [guided.previousButton(), guided.nextButton()]) expect((await b.boundingBox())!.height).toBeGreaterThanOrEqual(44);
      await p.screenshot({ path: `e2e/artifacts/guided-sewing-${name}-${colorScheme}.png`, fullPage: true });
      await ctx.close();
    }
  }
});
