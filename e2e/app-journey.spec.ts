import { expect, test, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { AuthPage } from './pages/auth.page';
import { PatternsPage } from './pages/patterns.page';
import { PatternPage } from './pages/pattern.page';
import { PrintPage } from './pages/print.page';
import { SharePage } from './pages/share.page';
import { SewingLogPage } from './pages/sewing-log.page';
import { ScaleCheckPage } from './pages/scale-check.page';
import { linkIn, waitForMail } from './pages/mail-inbox';
import { DraftingBoardPage, type InchPoint } from './pages/drafting-board.page';

/*
 * The app's journey against the real server with a fresh database (see playwright.config.ts):
 * a designer drafts, prints and shares; a quilter accepts, sews and checks the scale; a stranger
 * gets "not found". Every screen is saved under e2e/artifacts/ to be looked at.
 */

const run = Date.now().toString(36);
const designer = { name: 'Dana Designer', email: `dana-${run}@example.test`, password: 'plum-oat-sage-1', role: 'designer' as const };
const quilter = { name: 'Quinn Quilter', email: `quinn-${run}@example.test`, password: 'marigold-ink-22', role: 'quilter' as const };
const stranger = { name: 'Sam Stranger', email: `sam-${run}@example.test`, password: 'nobody-invited-3', role: 'designer' as const };

const C: InchPoint = { x: 12, y: 12 };
const polar = (r: number, deg: number): InchPoint => ({ x: C.x + r * Math.cos((deg * Math.PI) / 180), y: C.y + r * Math.sin((deg * Math.PI) / 180) });
const shot = (page: Page, name: string) => page.screenshot({ path: `e2e/artifacts/app-${name}.png`, fullPage: true });

/** Pages in a PDF, read by Mozilla's pdf.js (an independent reader). */
async function pdfPageCount(file: string): Promise<number> {
  const pdf = await getDocument({ data: new Uint8Array(readFileSync(file)), useSystemFonts: false, isEvalSupported: false }).promise;
  const n = pdf.numPages;
  await pdf.destroy();
  return n;
}

test.describe.configure({ mode: 'serial' });
test.use({ actionTimeout: 15_000, navigationTimeout: 20_000 });

test('designer drafts, prints and shares; quilter sews and checks the scale; a stranger sees not found', async ({ browser }) => {
  test.setTimeout(240_000);
  const designerCtx = await browser.newContext({ viewport: { width: 1366, height: 900 }, acceptDownloads: true });
  const page = await designerCtx.newPage();
  const consoleErrors: string[] = [];
  page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
  // No dialog is expected on this path (the leave-unsaved question is tested in app-conflict.spec.ts).
  const dialogs: string[] = [];
  page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });

  // --- The designer signs up.
  const auth = new AuthPage(page);
  await page.goto('/sign-up');
  await shot(page, 'sign-up');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('Your name is required')).toBeVisible();
  await shot(page, 'sign-up-errors');
  await auth.signUp(designer);
  await expect(page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await expect(page.getByText('No patterns yet')).toBeVisible();
  await shot(page, 'patterns-empty');

  // --- Creates a pattern.
  const patterns = new PatternsPage(page);
  await page.getByRole('button', { name: 'New pattern' }).click();
  await shot(page, 'new-pattern-dialog');
  await page.keyboard.press('Escape');
  const patternId = await patterns.create('Harvest Ring', 'Blank block');
  const patternUrl = `/patterns/${patternId}`;
  const patternPage = new PatternPage(page);
  await expect(patternPage.heading()).toHaveText('Harvest Ring');

  // --- Drafts an arc section (5–8 in., 90°) and splits it into 4 patches with three radial seams.
  const board = new DraftingBoardPage(page);
  // Tall enough that the whole board stays on screen while the panel beside it grows.
  await page.setViewportSize({ width: 1366, height: 1500 });
  await board.ready();
  await board.tool('a');
  await board.drag(C, { x: 20, y: 12 });
  await board.click({ x: 17, y: 12 });
  await board.click({ x: 12, y: 18 });
  await expect(board.hint()).toHaveText('Press at the centre and drag out to the outer radius');
  await board.tool('l');
  for (const deg of [22.5, 45, 67.5]) await board.drag(polar(5, deg), polar(8, deg));
  await expect.poll(() => board.boardLabels()).toEqual(['A1', 'A2', 'A3', 'A4']);
  // Fills the four patches with the selected fabric (Plum, the first of the pattern's fabrics).
  await board.tool('f');
  // One at a time: the board may re-fit its view when the panel beside it grows.
  for (const [i, deg] of [10, 30, 55, 80].entries()) {
    await board.click(polar(6.5, deg));
    await expect(board.orderList().getByText('Plum')).toHaveCount(i + 1);
  }
  const savedRevision = await patternPage.waitForSaved();
  expect(savedRevision).toBeGreaterThan(1);
  await shot(page, 'board');
  await page.setViewportSize({ width: 1366, height: 900 });

  // --- Cutting list.
  await patternPage.open('Cutting list');
  // The four Plum patches are cut from Plum; the unused fabrics are named, not listed as empty tables.
  const plum = page.getByRole('region', { name: 'Plum' });
  await expect(plum).toContainText('4 pieces');
  await expect(plum.getByRole('table', { name: 'Pieces of Plum' })).toContainText('A1');
  await expect(page.getByText('Not used by any patch: Oat, Sage.')).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Cautions' })).toContainText('Rotary cutters are very sharp');
  await shot(page, 'cutting-list');

  // --- Print: preview, make a print set, download it and count its pages with pdf.js.
  await patternPage.open('Print');
  const print = new PrintPage(page);
  await expect(print.sheetStatement()).toHaveText(/\d+ sheets? \(at least \d+ by area\)/);
  const previewSheets = await print.previewSheets().count();
  expect(previewSheets).toBeGreaterThan(0);
  await shot(page, 'print');
  const reportedPages = await print.make();
  await shot(page, 'print-set-ready');
  const download = await print.downloadLatest();
  expect(download.suggestedFilename()).toMatch(/\.pdf$/);
  const pdfFile = join(test.info().outputDir, download.suggestedFilename());
  await download.saveAs(pdfFile);
  await download.saveAs('e2e/artifacts/app-print-set.pdf');
  const pages = await pdfPageCount(pdfFile);
  expect(pages).toBe(reportedPages);
  // Cover + template sheets (+ cutting list): more pages than template sheets previewed.
  expect(pages).toBeGreaterThan(previewSheets);
  await expect(page.getByRole('region', { name: 'Print sets made' }).getByRole('listitem')).toHaveCount(1);

  // --- History.
  await patternPage.open('History');
  // Below the header: the board's autosaves (one sitting, revisions 2 to savedRevision) on one row, then revision 1.
  const historyRows = page.getByRole('table', { name: 'Revisions', exact: true }).getByRole('row');
  await expect(historyRows).toHaveCount(3);
  await expect(historyRows.nth(1)).toContainText(savedRevision > 2 ? `Revisions 2–${savedRevision}` : 'Revision 2');
  await shot(page, 'history');
  await page.getByRole('link', { name: 'Open revision 1 read-only' }).click();
  await expect(page.getByText('Revision 1', { exact: false }).first()).toBeVisible();
  await shot(page, 'revision-view');

  // --- Share: invite the quilter; the e-mail arrives at the local fake mail server.
  await page.goto(`${patternUrl}/share`);
  const share = new SharePage(page);
  await share.invite(quilter.email, 'Quilter');
  await expect(share.pendingInvitations()).toContainText(quilter.email);
  await shot(page, 'share');
  const invitation = await waitForMail(quilter.email, /shared "Harvest Ring" with you/);
  const acceptLink = linkIn(invitation, 'http');
  expect(acceptLink).toContain('/invitations/accept?token=');

  // --- Dark theme and the tablet layout of the pattern list.
  await patterns.goto();
  await expect(page.getByRole('link', { name: 'Harvest Ring' })).toBeVisible();
  await shot(page, 'patterns');
  await page.getByRole('button', { name: 'Use dark theme' }).click();
  await expect(page.locator('html')).toHaveClass(/sw-dark/);
  await shot(page, 'patterns-dark');
  await page.getByRole('button', { name: 'Use light theme' }).click();
  await page.setViewportSize({ width: 820, height: 1180 });
  await shot(page, 'patterns-tablet');
  await page.goto(`${patternUrl}/print`);
  await expect(print.sheetStatement()).toBeVisible();
  await shot(page, 'print-tablet');
  await page.setViewportSize({ width: 1366, height: 900 });
  await auth.signOut();
  await shot(page, 'sign-in');

  // --- The quilter follows the link, creates an account, accepts, and sees the pattern read-only.
  const quilterCtx = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const q = await quilterCtx.newPage();
  q.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()));
  await q.goto(acceptLink);
  await expect(q.getByText('invites you to')).toContainText('Harvest Ring');
  await shot(q, 'invitation-signed-out');
  await q.getByRole('link', { name: 'Create an account' }).click();
  await new AuthPage(q).signUp(quilter, new URL(acceptLink).pathname + new URL(acceptLink).search);
  await expect(q.getByRole('button', { name: 'Accept and open the pattern' })).toBeVisible();
  await shot(q, 'invitation');
  await q.getByRole('button', { name: 'Accept and open the pattern' }).click();
  await q.waitForURL(new RegExp(`${patternUrl}/board$`));
  await expect(q.getByText('Read-only', { exact: false }).first()).toBeVisible();
  await expect(new PatternPage(q).parts().getByRole('tab').filter({ hasText: 'Share' })).toHaveCount(0);
  await shot(q, 'board-read-only');

  // --- Logs the section's one copy as trimmed (2 of its 3 stages); the log survives a reload.
  const qPattern = new PatternPage(q);
  await qPattern.open('Sewing log');
  const log = new SewingLogPage(q);
  await log.mark('A', 'Trimmed');
  await expect(log.progress()).toHaveAttribute('aria-valuenow', '67');
  await q.reload();
  await expect(log.stageOf('A', 'Trimmed')).toHaveAttribute('aria-checked', 'true');
  await shot(q, 'sewing-log');

  // --- Scale check: 15/16 in. on the 1 in. square is a shrunk print; 1 in. is true.
  const scale = new ScaleCheckPage(q);
  await scale.goto();
  await scale.check('The 1 in. square', '15/16', 'in.');
  await expect(scale.verdict()).toHaveText('The print is too small');
  await expect(q.getByText('93.8 %')).toBeVisible();
  await shot(q, 'scale-check-shrunk');
  await scale.check('The 1 in. square', '1', 'in.');
  await expect(scale.verdict()).toHaveText('The print is true to size');
  await shot(q, 'scale-check-true');
  await quilterCtx.close();

  // --- A stranger's URL to the pattern shows "not found".
  const strangerCtx = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  const s = await strangerCtx.newPage();
  await new AuthPage(s).signUp(stranger);
  await expect(s.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  await s.goto(`${patternUrl}/cutting`);
  await expect(s.getByRole('heading', { name: 'Not found' })).toBeVisible();
  await expect(s.getByText('Harvest Ring')).toHaveCount(0);
  await shot(s, 'not-found');
  await strangerCtx.close();

  // --- Password reset: request, then the e-mailed link sets a new password.
  const resetCtx = await browser.newContext();
  const r = await resetCtx.newPage();
  await r.goto('/reset-password');
  await shot(r, 'reset-request');
  await r.getByLabel('E-mail').fill(designer.email);
  await r.getByRole('button', { name: 'Send the link' }).click();
  await expect(r.getByRole('status')).toContainText('on its way');
  const resetMail = await waitForMail(designer.email, /password/i);
  await r.goto(linkIn(resetMail, 'http'));
  await shot(r, 'reset-confirm');
  designer.password = 'a-new-plum-secret-9';
  await r.getByLabel('New password', { exact: true }).fill(designer.password);
  await r.getByLabel('New password again').fill(designer.password);
  await r.getByRole('button', { name: 'Save the new password' }).click();
  await expect(r.getByRole('status')).toContainText('Your password is changed');
  await resetCtx.close();

  // --- Admin: the designer made admin in the test database, then the admin screen with the dev inbox.
  const db = new Database(join(process.env['SW_E2E_DATA_DIR']!, 'seamwright.db'));
  db.prepare('UPDATE users SET role = ? WHERE email = ?').run('admin', designer.email);
  db.close();
  await auth.signIn(designer.email, designer.password);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Admin' }).click();
  await expect(page.getByRole('table', { name: 'Accounts' })).toContainText(quilter.email);
  await expect(page.getByRole('heading', { name: 'Development mail inbox' })).toBeVisible();
  await shot(page, 'admin');

  expect(dialogs).toEqual([]);
  expect(consoleErrors.filter((e) => !/status of 40[14]/.test(e))).toEqual([]);
  await designerCtx.close();
});
