import { TestBed } from '@angular/core/testing';
import { HttpErrorResponse } from '@angular/common/http';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { SaveVersionDialogComponent } from './save-version-dialog.component';
import type { Revision } from '../../core/api-types';

const made = { number: 9, version: { name: 'First fitting', note: null } } as unknown as Revision;

describe('SaveVersionDialogComponent', () => {
  function setup(save: (v: { name: string; note?: string }) => Promise<Revision>) {
    const ref = { close: vi.fn(), disableClose: false };
    TestBed.configureTestingModule({
      providers: [
        { provide: MatDialogRef, useValue: ref },
        { provide: MAT_DIALOG_DATA, useValue: { save } },
      ],
    });
    const fixture = TestBed.createComponent(SaveVersionDialogComponent);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const type = (selector: string, value: string) => {
      const input = el.querySelector(selector) as HTMLInputElement | HTMLTextAreaElement;
      input.value = value;
      input.dispatchEvent(new Event('input'));
    };
    const submit = async (name: string, note = '') => {
      type('input[formcontrolname=name]', name);
      type('textarea[formcontrolname=note]', note);
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      await fixture.whenStable();
      fixture.detectChanges();
    };
    const errors = () => Array.from(el.querySelectorAll('mat-error')).map((e) => e.textContent?.trim());
    return { el, ref, submit, errors, fixture };
  }

  it('asks for a name and saves nothing without one', async () => {
    const save = vi.fn();
    const { submit, errors, ref } = setup(save);
    await submit('   ', 'a note');
    expect(errors()).toEqual(['The name is required']);
    expect(save).not.toHaveBeenCalled();
    expect(ref.close).not.toHaveBeenCalled();
  });

  it('caps the name at 80 and the note at 500 characters, as the server does', () => {
    const { el } = setup(vi.fn());
    expect(el.querySelector('input[formcontrolname=name]')?.getAttribute('maxlength')).toBe('80');
    expect(el.querySelector('textarea[formcontrolname=note]')?.getAttribute('maxlength')).toBe('500');
    const label = (selector: string) => el.querySelector(selector)?.closest('mat-form-field')?.querySelector('mat-label')?.textContent?.trim();
    expect(label('input[formcontrolname=name]')).toBe('Version name');
    expect(label('textarea[formcontrolname=note]')).toBe('Note (optional)');
  });

  it('saves the trimmed name and note and closes with the new revision', async () => {
    const save = vi.fn(async () => made);
    const { submit, ref } = setup(save);
    await submit('  First fitting ', '  Before the border  ');
    expect(save).toHaveBeenCalledWith({ name: 'First fitting', note: 'Before the border' });
    expect(ref.close).toHaveBeenCalledWith(made);
  });

  it('leaves out an empty note', async () => {
    const save = vi.fn(async () => made);
    const { submit } = setup(save);
    await submit('First fitting', '   ');
    expect(save).toHaveBeenCalledWith({ name: 'First fitting' });
  });

  it('stays open with the server’s word on the field it names', async () => {
    const save = vi.fn(async () => {
      throw new HttpErrorResponse({ status: 400, error: { error: 'Invalid request', details: [{ path: 'name', message: 'must not be empty' }] } });
    });
    const { submit, errors, ref, el } = setup(save);
    await submit('x');
    expect(errors()).toEqual(['must not be empty']);
    expect(el.querySelector('[role=alert]')).toBeNull();
    expect(ref.close).not.toHaveBeenCalled();
    expect(ref.disableClose).toBe(false);
  });

  it('stays open and says why when the save is refused as a whole', async () => {
    const save = vi.fn(async () => {
      throw new Error('Someone else saved first: choose what to do with your drawing, then save the version');
    });
    const { submit, ref, el } = setup(save);
    await submit('First fitting');
    expect(el.querySelector('[role=alert]')?.textContent?.trim()).toBe(
      'Not saved: Someone else saved first: choose what to do with your drawing, then save the version',
    );
    expect(ref.close).not.toHaveBeenCalled();
    expect((el.querySelector('button[type=submit]') as HTMLButtonElement).disabled).toBe(false);
  });
});
