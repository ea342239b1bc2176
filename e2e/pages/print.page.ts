import { expect, type Download, type Page } from '@playwright/test';

/** The Print part: options, sheet preview, making and downloading print sets. */
export class PrintPage {
  constructor(private readonly page: Page) {}

  async choosePaper(name: RegExp): Promise<void> {
    await this.page.getByLabel('Paper').click();
    await this.page.getByRole('option', { name }).click();
  }

  /** The "N sheets (at least M by area)" line of the preview. */
  sheetStatement() {
    return this.page.getByRole('region', { name: 'Sheets' }).locator('p strong').first();
  }

  previewSheets() {
    return this.page.getByRole('region', { name: 'Sheets' }).locator('sw-sheet-preview');
  }

  /** Makes a print set and waits until it is ready; returns the page count the app reports. */
  async make(): Promise<number> {
    await this.page.getByRole('button', { name: 'Make print set' }).click();
    const ready = this.page.getByRole('status').filter({ hasText: /Ready: \d+ pages/ });
    await expect(ready).toBeVisible({ timeout: 45_000 });
    return Number(/Ready: (\d+) pages/.exec((await ready.textContent()) ?? '')?.[1]);
  }

  async downloadLatest(): Promise<Download> {
    const wait = this.page.waitForEvent('download');
    await this.page.getByRole('status').getByRole('link', { name: 'Download' }).click();
    return wait;
  }
}
