import { type Page } from '@playwright/test';

/** The Guided sewing part: one step at a time, next and previous by buttons or keys. */
export class GuidedSewingPage {
  constructor(private readonly page: Page) {}

  async goto(patternId: string): Promise<void> {
    await this.page.goto(`/patterns/${patternId}/sew`);
  }

  /** The step heading ("Step 2 of 4: add A2"); focus moves to it after next or previous. */
  stepHeading() {
    return this.page.getByRole('heading', { level: 2, name: /^(Step|Join) \d+ of \d+/ });
  }

  nextButton() {
    return this.page.getByRole('button', { name: /^(Next step|Finish)/ });
  }

  previousButton() {
    return this.page.getByRole('button', { name: 'Previous step' });
  }

  /** The sections in joining order (and the joins), each a button. */
  parts() {
    return this.page.getByRole('navigation', { name: 'Sections in joining order' });
  }

  /** One part of the instructions: Piece, Where it goes, Sew, Press, Pre-trim, Trim … */
  instruction(name: string) {
    return this.page.getByRole('region', { name });
  }

  picture() {
    return this.page.locator('sw-guide-drawing svg[role="img"]');
  }

  /** Presses a key on the page (ArrowRight or N next, ArrowLeft or P previous). */
  async press(key: 'ArrowRight' | 'ArrowLeft' | 'n' | 'p'): Promise<void> {
    await this.page.keyboard.press(key);
  }
}
