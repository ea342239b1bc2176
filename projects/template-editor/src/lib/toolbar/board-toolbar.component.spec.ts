import { TestBed } from '@angular/core/testing';
import { TestKey } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import { buildOrchardWheel } from '@seamwright/piecing';
import { EditorSession } from '../session/editor-session';
import { BoardToolbarComponent } from './board-toolbar.component';

function setUp() {
  TestBed.configureTestingModule({ providers: [EditorSession] });
  const fixture = TestBed.createComponent(BoardToolbarComponent);
  fixture.detectChanges();
  return { fixture, session: TestBed.inject(EditorSession), el: fixture.nativeElement as HTMLElement };
}

describe('BoardToolbarComponent', () => {
  it('offers every tool with its key and switches the board to the one pressed', () => {
    const { fixture, session, el } = setUp();
    const titles = [...el.querySelectorAll('mat-button-toggle[data-tool]')].map((t) => t.getAttribute('title'));
    expect(titles).toEqual([
      'Select (V)',
      'Pan (H)',
      'Straight section (S)',
      'Arc section (A)',
      'Wedge section (W)',
      'Split (L)',
      'Ring repeat (R)',
      'Fabric fill (F)',
      'Strip set (T)',
      'Renumber (N)',
      'Delete (D)',
    ]);
    (el.querySelector('mat-button-toggle[data-tool="wedge"] button') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(session.toolId()).toBe('wedge');
  });

  it('turns the seam allowance preview and the mirrored view on and off', () => {
    const { fixture, session, el } = setUp();
    const toggle = (name: string) => [...el.querySelectorAll('mat-slide-toggle')].find((t) => t.textContent?.includes(name))!.querySelector('button')!;
    toggle('Seam allowance').click();
    fixture.detectChanges();
    expect(session.settings().showSeamAllowance).toBe(true);
    toggle('Mirrored').click();
    fixture.detectChanges();
    expect(session.settings().mirrored).toBe(true);
    expect(session.editor.viewport.mirrored).toBe(true);
  });

  it('switches the board to centimetres with the 0.5 cm snap', () => {
    const { fixture, session, el } = setUp();
    const cm = [...el.querySelectorAll('mat-button-toggle')].find((t) => t.textContent?.trim() === 'cm')!.querySelector('button')!;
    cm.click();
    fixture.detectChanges();
    expect(session.settings().unit).toBe('cm');
    expect(session.settings().grid).toBe('half-cm');
  });

  it('shows no snap controls on a read-only board, and keeps the view controls', () => {
    const { fixture, session, el } = setUp();
    const labels = () => [...el.querySelectorAll('mat-slide-toggle')].map((t) => t.textContent?.trim());
    expect(labels()).toEqual(['Snap to points', 'Snap angles', 'Seam allowance', 'Mirrored']);
    expect(el.querySelector('mat-select[aria-label="Grid snap"]')).not.toBeNull();
    session.editor.setReadOnly(true);
    fixture.detectChanges();
    expect(labels()).toEqual(['Seam allowance', 'Mirrored']);
    expect(el.querySelector('mat-select[aria-label="Grid snap"]')).toBeNull();
    expect(el.querySelector('button[aria-label="Zoom in"]')).not.toBeNull();
  });

  it('zooms in and out about the middle of the board', () => {
    const { fixture, session, el } = setUp();
    const before = session.editor.viewport.scale;
    (el.querySelector('button[aria-label="Zoom in"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(session.editor.viewport.scale).toBeCloseTo(before * 1.25, 9);
    (el.querySelector('button[aria-label="Zoom out"]') as HTMLButtonElement).click();
    expect(session.editor.viewport.scale).toBeCloseTo(before, 9);
  });
});

describe('BoardToolbarComponent colourway choice', () => {
  function withWheel() {
    const set = setUp();
    set.session.load(buildOrchardWheel());
    set.fixture.detectChanges();
    return set;
  }
  const trigger = (el: HTMLElement) => el.querySelector<HTMLElement>('mat-select[data-testid="board-colourway"]')!;

  it('offers the pattern fabrics and each colourway by name, and shows the chosen one on the board without touching the document', async () => {
    const { fixture, session } = withWheel();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const select = await loader.getHarness(MatSelectHarness.with({ selector: '[data-testid="board-colourway"]' }));
    expect(await select.getValueText()).toBe('Pattern fabrics');
    await select.open();
    expect((await select.getOptions()).length).toBe(3);
    expect(await Promise.all((await select.getOptions()).map((o) => o.getText()))).toEqual(['Pattern fabrics', 'Dusk', 'Frost']);
    const doc = session.document();
    await select.clickOptions({ text: 'Frost' });
    expect(session.colourwayId()).toBe('frost');
    expect(session.shownColourway()?.name).toBe('Frost');
    expect(session.document()).toBe(doc);
    expect(session.canUndo()).toBe(false);
    expect(session.dirty()).toBe(false);
    // The fabric to fill with says what each pattern fabric shows as in the colourway.
    const fill = await loader.getHarness(MatSelectHarness.with({ selector: '[aria-label="Fabric to fill with"]' }));
    await fill.open();
    expect(await (await fill.getOptions())[0].getText()).toBe('Plum (in Frost: Spruce)');
    await fill.close();
    await select.open();
    await select.clickOptions({ text: 'Pattern fabrics' });
    expect(session.colourwayId()).toBeNull();
    expect(session.document()).toBe(doc);
  });

  it('is named, reached by keys, and keeps the focus after a choice made with the arrow keys', async () => {
    const { fixture, session, el } = withWheel();
    const t = trigger(el);
    expect(t.getAttribute('aria-label')).toBe('Board colourway');
    expect(t.getAttribute('tabindex')).toBe('0');
    const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: '[data-testid="board-colourway"]' }));
    await (await select.host()).sendKeys(TestKey.DOWN_ARROW);
    expect(session.colourwayId()).toBe('dusk');
    expect(document.activeElement).toBe(t);
    expect(session.canUndo()).toBe(false);
  });

  it('is not offered for a pattern without colourways', () => {
    const { el } = setUp();
    expect(trigger(el)).toBeNull();
  });
});
