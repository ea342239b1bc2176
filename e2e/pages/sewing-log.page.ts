import { type Page } from '@playwright/test';

/** The Sewing log part. */
export class SewingLogPage {
  constructor(private readonly page: Page) {}

  async mark(sectionLabel: string, stage: 'Not started' | 'Cut' | 'Sewn' | 'Trimmed'): Promise<void> {
    await this.page.getByRole('radiogroup', { name: `Stage of section ${sectionLabel}` }).getByRole('radio', { name: stage }).click();
  }

  stageOf(sectionLabel: string, stage: string) {
    return this.page.getByRole('radiogroup', { name: `Stage of section ${sectionLabel}` }).getByRole('radio', { name: stage });
  }

  progress() {
    return this.page.getByRole('progressbar', { name: 'Progress of the pattern' });
  }
}
