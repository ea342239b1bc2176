import { expect, type Page } from '@playwright/test';

/** The pattern list. */
export class PatternsPage {
  constructor(private readonly page: Page) {}

  async goto(): Promise<void> {
    await this.page.goto('/patterns');
    await expect(this.page.getByRole('heading', { name: 'Patterns' })).toBeVisible();
  }

  /** Creates a pattern through "New pattern" and waits for its Drafting board. Returns the pattern id. */
  async create(title: string, starter: 'Blank block' | 'Two straight sections' | 'Ring of eight arcs' = 'Blank block'): Promise<string> {
    await this.page.getByRole('button', { name: 'New pattern' }).click();
    const dialog = this.page.getByRole('dialog', { name: 'New pattern' });
    await dialog.getByLabel('Title').fill(title);
    await dialog.getByRole('radio', { name: new RegExp(starter) }).check();
    await dialog.getByRole('button', { name: 'Create' }).click();
    await this.page.waitForURL(/\/patterns\/[^/]+\/board$/);
    return new URL(this.page.url()).pathname.split('/')[2];
  }

  row(title: string) {
    return this.page.getByRole('row').filter({ has: this.page.getByRole('link', { name: title, exact: true }) });
  }
}
