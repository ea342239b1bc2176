import { type Page } from '@playwright/test';

/** The Scale check. */
export class ScaleCheckPage {
  constructor(private readonly page: Page) {}

  async goto(): Promise<void> {
    await this.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Scale check' }).click();
  }

  async check(square: 'The 1 in. square' | 'The 2 cm square', measured: string, unit: 'in.' | 'cm'): Promise<void> {
    await this.page.getByRole('radio', { name: square }).click();
    await this.page.getByRole('radiogroup', { name: 'Unit' }).getByRole('radio', { name: unit }).click();
    await this.page.getByLabel('It measures').fill(measured);
    await this.page.getByRole('button', { name: 'Check' }).click();
  }

  verdict() {
    return this.page.locator('#verdict-title');
  }
}
