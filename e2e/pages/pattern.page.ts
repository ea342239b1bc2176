import { expect, type Page } from '@playwright/test';

export type PatternPart = 'Drafting board' | 'Cutting list' | 'Print' | 'Sewing log' | 'History' | 'Share';

const PART_PATHS: Record<PatternPart, string> = {
  'Drafting board': 'board',
  'Cutting list': 'cutting',
  Print: 'print',
  'Sewing log': 'sewing-log',
  History: 'history',
  Share: 'share',
};

/** The pattern page and its parts (child routes). */
export class PatternPage {
  constructor(private readonly page: Page) {}

  async open(part: PatternPart): Promise<void> {
    await this.parts().getByRole('tab').filter({ hasText: part }).click();
    await this.page.waitForURL(new RegExp(`/patterns/[^/]+/${PART_PATHS[part]}$`));
  }

  /** The tab bar of the pattern's parts (links rendered as tabs). */
  parts() {
    return this.page.getByRole('tablist', { name: 'Parts of the pattern' });
  }

  heading() {
    return this.page.getByRole('heading', { level: 1 });
  }

  /** Waits until autosave has stored the board's changes; returns the revision it names. */
  async waitForSaved(): Promise<number> {
    const status = this.page.getByRole('status').filter({ hasText: /All changes saved/ });
    await expect(status).toBeVisible({ timeout: 20_000 });
    const text = (await status.textContent()) ?? '';
    return Number(/revision (\d+)/.exec(text)?.[1]);
  }
}
