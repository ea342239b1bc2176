import { TestBed } from '@angular/core/testing';
import { MatDialogRef } from '@angular/material/dialog';
import { NewPatternDialogComponent } from './new-pattern-dialog.component';
import { STARTERS } from './starters';
import { parsePatternDocument } from '@seamwright/piecing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { fillIn, shownErrors } from '../testing/material-form';

describe('NewPatternDialogComponent', () => {
  function setup() {
    const close = vi.fn();
    TestBed.configureTestingModule({ providers: [{ provide: MatDialogRef, useValue: { close } }] });
    const fixture = TestBed.createComponent(NewPatternDialogComponent);
    fixture.detectChanges();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const create = async (title: string) => {
      await fillIn(loader, { Title: title });
      await (await loader.getHarness(MatButtonHarness.with({ text: 'Create' }))).click();
    };
    return { loader, close, create };
  }

  it('asks for a title and does not close without one', async () => {
    const { loader, close, create } = setup();
    await create('   ');
    expect(await shownErrors(loader)).toEqual(['Title is required']);
    expect(close).not.toHaveBeenCalled();
  });

  it('hands back the trimmed title and the starter chosen', async () => {
    const { loader, close, create } = setup();
    await (await loader.getHarness(MatRadioButtonHarness.with({ label: new RegExp(`^${STARTERS[2].name} —`) }))).check();
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
