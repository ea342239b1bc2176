import { TestBed } from '@angular/core/testing';
import { MatDialogRef } from '@angular/material/dialog';
import { NewPatternDialogComponent } from './new-pattern-dialog.component';
import { STARTERS } from './starters';
import { parsePatternDocument } from '@seamwright/piecing';

describe('NewPatternDialogComponent', () => {
  function setup() {
    const close = vi.fn();
    TestBed.configureTestingModule({ providers: [{ provide: MatDialogRef, useValue: { close } }] });
    const fixture = TestBed.createComponent(NewPatternDialogComponent);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const title = el.querySelector('input[formcontrolname=title]') as HTMLInputElement;
    const create = async (value: string) => {
      title.value = value;
      title.dispatchEvent(new Event('input'));
      (el.querySelector('button[type=submit]') as HTMLButtonElement).click();
      await fixture.whenStable();
    };
    return { el, close, create };
  }

  it('asks for a title and does not close without one', async () => {
    const { el, close, create } = setup();
    await create('   ');
    expect(el.querySelector('mat-error')?.textContent?.trim()).toBe('Title is required');
    expect(close).not.toHaveBeenCalled();
  });

  it('hands back the trimmed title and the starter chosen', async () => {
    const { el, close, create } = setup();
    (el.querySelectorAll('mat-radio-button input')[2] as HTMLInputElement).click();
    await create('  Harvest Ring ');
    expect(close).toHaveBeenCalledWith({ title: 'Harvest Ring', starterId: STARTERS[2].id });
  });

  it('offers only starters the document schema accepts', () => {
    for (const s of STARTERS) {
      const r = parsePatternDocument(s.build(`Starter ${s.name}`));
      expect(r.ok, `${s.id}: ${r.ok ? '' : JSON.stringify(r.issues)}`).toBe(true);
    }
  });
});
