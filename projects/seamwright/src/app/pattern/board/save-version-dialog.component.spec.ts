import { TestBed } from '@angular/core/testing';
import { HttpErrorResponse } from '@angular/common/http';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { SaveVersionDialogComponent } from './save-version-dialog.component';
import type { Revision } from '../../core/api-types';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { fillIn, shownErrors } from '../../testing/material-form';

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
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const saveButton = () => loader.getHarness(MatButtonHarness.with({ text: 'Save version' }));
    const submit = async (name: string, note = '') => {
      await fillIn(loader, { 'Version name': name, 'Note (optional)': note });
      await (await saveButton()).click();
    };
    const errors = () => shownErrors(loader);
    return { el, ref, loader, submit, errors, saveButton };
  }

  it('asks for a name and saves nothing without one', async () => {
    const save = vi.fn();
    const { submit, errors, ref } = setup(save);
    await submit('   ', 'a note');
    expect(await errors()).toEqual(['The name is required']);
    expect(save).not.toHaveBeenCalled();
    expect(ref.close).not.toHaveBeenCalled();
  });

  it('caps the name at 80 and the note at 500 characters, as the server does', async () => {
    const { loader } = setup(vi.fn());
    const maxLength = async (label: string) => (await (await loader.getHarness(MatInputHarness.with({ label }))).host()).getAttribute('maxlength');
    expect(await maxLength('Version name')).toBe('80');
    expect(await maxLength('Note (optional)')).toBe('500');
    expect(await (await loader.getHarness(MatInputHarness.with({ label: 'Note (optional)' }))).getType()).toBe('textarea');
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
    expect(await errors()).toEqual(['must not be empty']);
    expect(el.querySelector('[role=alert]')).toBeNull();
    expect(ref.close).not.toHaveBeenCalled();
    expect(ref.disableClose).toBe(false);
  });

  it('stays open and says why when the save is refused as a whole', async () => {
    const save = vi.fn(async () => {
      throw new Error('Someone else saved first: choose what to do with your drawing, then save the version');
    });
    const { submit, ref, el, saveButton } = setup(save);
    await submit('First fitting');
    expect(el.querySelector('[role=alert]')?.textContent?.trim()).toBe(
      'Not saved: Someone else saved first: choose what to do with your drawing, then save the version',
    );
    expect(ref.close).not.toHaveBeenCalled();
    expect(await (await saveButton()).isDisabled()).toBe(false);
  });
});
