import { type Page } from '@playwright/test';

export type SewingStageName = 'Not started' | 'Pieced' | 'Trimmed' | 'Joined';

/** The Sewing log part: a stage per copy of each section, and the pattern's progress. */
export class SewingLogPage {
  constructor(private readonly page: Page) {}

  /** The stage buttons of one copy of a section (copies count from 1). */
  copy(sectionLabel: string, copy = 1) {
    return this.page.getByRole('radiogroup', { name: new RegExp(`^Stage of section ${sectionLabel}, copy ${copy} of \\d+`) });
  }

  async mark(sectionLabel: string, stage: SewingStageName, copy = 1): Promise<void> {
    await this.copy(sectionLabel, copy).getByRole('radio', { name: stage }).click();
  }

  stageOf(sectionLabel: string, stage: SewingStageName, copy = 1) {
    return this.copy(sectionLabel, copy).getByRole('radio', { name: stage });
  }

  progress() {
    return this.page.getByRole('progressbar', { name: 'Progress of the pattern' });
  }
}
