import { expect, type Page } from '@playwright/test';

/** The Share part: invitations and members. */
export class SharePage {
  constructor(private readonly page: Page) {}

  async invite(email: string, access: 'Quilter' | 'Co-designer'): Promise<void> {
    await this.page.getByLabel('E-mail address').fill(email);
    await this.page.getByRole('combobox', { name: 'Access', exact: true }).click();
    await this.page.getByRole('option', { name: new RegExp(`^${access}`) }).click();
    await this.page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(this.page.getByText(`Invitation sent to ${email}`)).toBeVisible();
  }

  pendingInvitations() {
    return this.page.getByRole('region', { name: 'Invitations not yet accepted' });
  }
}
