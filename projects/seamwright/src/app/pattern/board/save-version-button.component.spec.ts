import { TestBed } from '@angular/core/testing';
import { Component, signal } from '@angular/core';
import { SaveVersionButtonComponent, type VersionSaver } from './save-version-button.component';
import type { SaveStatus } from './board-autosave';
import type { Revision } from '../../core/api-types';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { fillIn } from '../../testing/material-form';

@Component({
  imports: [SaveVersionButtonComponent],
  template: `<sw-save-version-button [autosave]="saver" />`,
})
class HostComponent {
  readonly status = signal<SaveStatus>('pending');
  readonly saveVersion = vi.fn(async (v: { name: string; note?: string }) => ({ number: 7, version: { name: v.name, note: v.note ?? null } }) as unknown as Revision);
  readonly saver: VersionSaver = { status: this.status, saveVersion: this.saveVersion };
}

describe('SaveVersionButtonComponent', () => {
  function setup() {
    const fixture = TestBed.createComponent(HostComponent);
    fixture.detectChanges();
    const button = () => TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: /Save as version$/ }));
    return { host: fixture.componentInstance, button, page: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  afterEach(() => document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = '')));

  it('opens the dialog, stores the version through autosave and says so', async () => {
    const { host, button, page } = setup();
    await (await button()).click();
    const dialog = await page.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Save as version');
    await fillIn(dialog, { 'Version name': 'Ready to sew' });
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Save version' }))).click();
    await vi.waitFor(async () => expect(await page.getAllHarnesses(MatDialogHarness)).toEqual([]));
    expect(host.saveVersion).toHaveBeenCalledWith({ name: 'Ready to sew' });
    await vi.waitFor(async () => expect(await (await page.getHarness(MatSnackBarHarness)).getMessage()).toMatch(/^Saved as version “Ready to sew” \(revision 7\)/));
  });

  it('is unavailable while a conflict waits for the user', async () => {
    const { host, button } = setup();
    expect(await (await button()).isDisabled()).toBe(false);
    host.status.set('conflict');
    expect(await (await button()).isDisabled()).toBe(true);
  });
});
