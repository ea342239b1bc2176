import { TestBed } from '@angular/core/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { EditorSession } from '../session/editor-session';
import { PropertiesPanelComponent } from './properties-panel.component';
import { stripSetSquare } from '../../../../../tests/fixtures/strip-set-square';

/** A 6 in. square split at x = 3: A1 (Plum) on the left, A2 (an Oat/Plum strip set) on the right. */
function pattern(): PatternDocument {
  return readPatternDocument(stripSetSquare({ title: 'Cutting', sizeIn: 6, canvasIn: 12, stripWidthIn: 1.5, stripSetId: 't-k2x9' }));
}

async function setUp(label: 'A1' | 'A2') {
  TestBed.configureTestingModule({ providers: [EditorSession] });
  const session = TestBed.inject(EditorSession);
  session.load(pattern());
  // Patches are selected by their identity (their place in the split), not their number.
  const patchIndex = session.editor.analysis.patches(session.document().sections[0]).find((p) => p.label === label)!.index;
  session.editor.store.select({ sectionId: 'sq', patchIndex });
  const fixture = TestBed.createComponent(PropertiesPanelComponent);
  fixture.detectChanges();
  await fixture.whenStable();
  const loader: HarnessLoader = TestbedHarnessEnvironment.loader(fixture);
  const el = fixture.nativeElement as HTMLElement;
  const assignment = (n: number) => session.document().sections[0].patches.find((p) => p.number === n)!;
  return { fixture, session, loader, el, assignment };
}

// Harness steps are slow on a busy two-core machine; the default 5 s is too short for a whole story.
describe('Cutting and pressing in the properties panel', { timeout: 30_000 }, () => {
  it('says the computed rough cut, and one typed side sets a square the patch keeps; emptying it goes back', async () => {
    const { session, loader, el, assignment } = await setUp('A1');
    // A1 is 3 × 6 in.: with ¼ in. allowance and ½ in. margin each side it is cut 4 ½ × 7 ½ in. (design.md §5.5).
    expect(el.querySelector('[data-testid="rough-cut-state"]')!.textContent).toContain('Computed: 4 1/2 × 7 1/2 in.');
    const width = await loader.getHarness(MatInputHarness.with({ selector: '[aria-label="Rough-cut width"]' }));
    expect(await width.getPlaceholder()).toBe('computed: 4 1/2');
    await width.setValue('3');
    await (await width.host()).dispatchEvent('keydown', { key: 'Enter' });
    expect(assignment(1).roughCut).toEqual({ widthIn: 3, lengthIn: 3 });
    expect(el.querySelector('[data-testid="rough-cut-state"]')!.textContent).toContain('Set by you: 3 in. square.');
    const length = await loader.getHarness(MatInputHarness.with({ selector: '[aria-label="Rough-cut length"]' }));
    await length.setValue('4 1/4');
    await (await length.host()).dispatchEvent('keydown', { key: 'Enter' });
    expect(assignment(1).roughCut).toEqual({ widthIn: 3, lengthIn: 4.25 });
    expect(session.editor.store.undoDepth).toBe(2);
    await length.setValue('');
    await (await length.host()).dispatchEvent('keydown', { key: 'Enter' });
    expect(assignment(1).roughCut).toBeUndefined();
    // Fabric is untouched by all of it.
    expect(assignment(1).fabricId).toBe('plum');
  });

  it('refuses text that is not a length and says why', async () => {
    const { loader, assignment, fixture, el } = await setUp('A1');
    const width = await loader.getHarness(MatInputHarness.with({ selector: '[aria-label="Rough-cut width"]' }));
    await width.setValue('three');
    await (await width.host()).dispatchEvent('keydown', { key: 'Enter' });
    fixture.detectChanges();
    expect(assignment(1).roughCut).toBeUndefined();
    expect(el.querySelector('mat-error')?.textContent?.trim().length).toBeGreaterThan(3);
  });

  it('asks for a piece template by the checkbox; a strip-set patch always has one', async () => {
    const first = await setUp('A1');
    const box = await first.loader.getHarness(MatCheckboxHarness.with({ label: 'Piece template' }));
    expect(await box.isChecked()).toBe(false);
    await box.check();
    expect(first.assignment(1).pieceTemplate).toBe(true);
    await box.uncheck();
    expect('pieceTemplate' in first.assignment(1)).toBe(false);
    TestBed.resetTestingModule();
    const strips = await setUp('A2');
    const fixed = await strips.loader.getHarness(MatCheckboxHarness.with({ label: 'Piece template' }));
    expect([await fixed.isChecked(), await fixed.isDisabled()]).toEqual([true, true]);
  });

  it("names a strip-set patch's set and sets its sub-cut length", async () => {
    const { loader, assignment } = await setUp('A2');
    const name = await loader.getHarness(MatInputHarness.with({ selector: '[aria-label="Strip set name"]' }));
    expect(await name.getPlaceholder()).toBe('Strip set for A2');
    await name.setValue('Road stripes');
    await (await name.host()).dispatchEvent('change');
    const sub = await loader.getHarness(MatInputHarness.with({ selector: '[aria-label="Sub-cut length"]' }));
    await sub.setValue('7 1/2');
    await (await sub.host()).dispatchEvent('keydown', { key: 'Enter' });
    expect(assignment(2).stripSet).toMatchObject({ name: 'Road stripes', subCutLengthIn: 7.5 });
  });

  it("sets a seam's pressing from the list of three, as one undo step", async () => {
    const { session, loader } = await setUp('A1');
    const select = await loader.getHarness(MatSelectHarness.with({ ancestor: '.span' }));
    expect(await select.getValueText()).toBe('Toward the patch just added');
    await select.open();
    expect((await select.getOptions()).length).toBe(3);
    await select.clickOptions({ text: 'Open' });
    expect(session.document().sections[0].seams[0].press).toBe('open');
    expect(session.editor.store.undoDepth).toBe(1);
    session.undo();
    expect(session.document().sections[0].seams[0].press).toBeUndefined();
  });
});
