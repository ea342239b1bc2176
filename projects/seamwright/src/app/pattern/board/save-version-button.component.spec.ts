import { TestBed } from '@angular/core/testing';
import { Component, signal } from '@angular/core';
import { SaveVersionButtonComponent, type VersionSaver } from './save-version-button.component';
import type { SaveStatus } from './board-autosave';
import type { Revision } from '../../core/api-types';

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
    const button = fixture.nativeElement.querySelector('button') as HTMLButtonElement;
    return { fixture, host: fixture.componentInstance, button };
  }

  afterEach(() => document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = '')));

  it('opens the dialog, stores the version through autosave and says so', async () => {
    const { fixture, host, button } = setup();
    expect(button.textContent?.replace('bookmark_add', '').trim()).toBe('Save as version');
    button.click();
    fixture.detectChanges();
    await fixture.whenStable();
    const dialog = document.querySelector('[role=dialog]') as HTMLElement;
    expect(dialog.querySelector('h2')?.textContent).toBe('Save as version');
    const name = dialog.querySelector('input[formcontrolname=name]') as HTMLInputElement;
    name.value = 'Ready to sew';
    name.dispatchEvent(new Event('input'));
    (dialog.querySelector('button[type=submit]') as HTMLButtonElement).click();
    await vi.waitFor(() => expect(document.querySelector('[role=dialog]')).toBeNull());
    expect(host.saveVersion).toHaveBeenCalledWith({ name: 'Ready to sew' });
    await vi.waitFor(() => expect(document.querySelector('.mat-mdc-snack-bar-label')?.textContent?.trim()).toMatch(/^Saved as version “Ready to sew” \(revision 7\)/));
  });

  it('is unavailable while a conflict waits for the user', () => {
    const { fixture, host, button } = setup();
    expect(button.disabled).toBe(false);
    host.status.set('conflict');
    fixture.detectChanges();
    expect(button.disabled).toBe(true);
  });
});
