import { TestBed } from '@angular/core/testing';
import { buildCuttingList, buildGardenGate, derivePatches, polygonArea, readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { EditorSession } from '../session/editor-session';
import { PatternSettingsPanelComponent } from './pattern-settings-panel.component';
import { stripSetSquare } from '../../../../../tests/fixtures/strip-set-square';

/** A 12 in. pattern: section A (a 6 in. square, Plum fill and an unnamed Oat/Plum strip set), Sage unused. */
function pattern(): PatternDocument {
  return readPatternDocument(
    stripSetSquare({ title: 'Settings', sizeIn: 6, canvasIn: 12, stripWidthIn: 1.5, stripSetId: 't-k2x9', extraFabrics: [{ id: 'sage', name: 'Sage', colour: '#8fa382' }] }),
  );
}

function setUp(doc: PatternDocument = pattern()) {
  TestBed.configureTestingModule({ providers: [EditorSession] });
  const session = TestBed.inject(EditorSession);
  session.load(doc);
  const fixture = TestBed.createComponent(PatternSettingsPanelComponent);
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  const byLabel = <T extends HTMLElement>(label: string) => {
    const found = el.querySelector<T>(`[aria-label="${label}"]`);
    if (!found) throw new Error(`no control labelled "${label}"`);
    return found;
  };
  const button = (name: string) => {
    const found = [...el.querySelectorAll('button')].find((b) => b.getAttribute('aria-label') === name || b.textContent?.trim() === name);
    if (!found) throw new Error(`no button "${name}"`);
    return found;
  };
  /** Types into a field and presses Enter, as a person does. */
  const type = (label: string, text: string) => {
    const input = byLabel<HTMLInputElement>(label);
    input.value = text;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    input.dispatchEvent(new Event('change'));
    fixture.detectChanges();
  };
  return { fixture, session, el, byLabel, button, type };
}

describe('PatternSettingsPanelComponent', () => {
  it('changes the sewing numbers, each as one undoable step', () => {
    const { session, type } = setUp();
    type('Blocks in the quilt', '12');
    type('Pressings per template', '20');
    type('Seam allowance', '3/8');
    type('Piecing margin', '1 cm');
    const d = session.document();
    expect([d.blockCount, d.pressingsPerTemplate, d.seamAllowanceIn]).toEqual([12, 20, 0.375]);
    expect(d.piecingMarginIn).toBeCloseTo(1 / 2.54, 12);
    session.undo();
    expect(session.document().piecingMarginIn).toBe(0.5);
  });

  it("keeps the designer's notes for the quilter, trimmed, as one undoable step", () => {
    const { session, el, fixture } = setUp();
    const notes = el.querySelector<HTMLTextAreaElement>('textarea')!;
    expect(el.querySelector(`label[for="${notes.id}"]`)?.textContent?.trim()).toBe('Pattern notes');
    notes.value = '  Press the B ring seams all one way round.\n';
    notes.dispatchEvent(new Event('input'));
    notes.dispatchEvent(new Event('change'));
    fixture.detectChanges();
    expect(session.document().notes).toBe('Press the B ring seams all one way round.');
    expect(session.editor.store.undoDepth).toBe(1);
    session.undo();
    expect(session.document().notes).toBeUndefined();
  });

  it('refuses a block count that is not a whole number, saying why', () => {
    const { session, el, type } = setUp();
    type('Blocks in the quilt', '2.5');
    expect(session.document().blockCount).toBe(1);
    expect(el.textContent).toContain('enter a whole number');
  });

  it('adds, renames and recolours fabrics; a colour picker has a name', () => {
    const { session, el, button, byLabel, type } = setUp();
    button('Add fabric').click();
    expect(session.document().fabrics.map((f) => f.name)).toEqual(['Plum', 'Oat', 'Sage', 'Fabric 4']);
    type('Name of fabric Oat', ' Oatmeal ');
    expect(session.document().fabrics[1].name).toBe('Oatmeal');
    type('Name of fabric Oatmeal', 'plum');
    expect(session.document().fabrics[1].name).toBe('Oatmeal');
    expect(el.querySelector('[role="alert"]')?.textContent).toContain('another fabric is called plum');
    const picker = byLabel<HTMLInputElement>('Colour of Sage');
    expect(picker.type).toBe('color');
    expect(el.querySelector(`label[for="${picker.id}"]`)?.textContent).toBe('Colour');
    picker.value = '#336699';
    picker.dispatchEvent(new Event('change'));
    expect(session.document().fabrics[2].colour).toBe('#336699');
  });

  it('changes a fabric usable width, typed as quilters write it', () => {
    const { session, el } = setUp();
    const sage = el.querySelector('li[aria-label="Sage"]')!;
    const input = sage.querySelector<HTMLInputElement>('input[aria-label="Usable width"]')!;
    input.value = '40 1/2';
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    expect(session.document().fabrics[2].usableWofIn).toBe(40.5);
  });

  it('removes only an unused fabric; a used one says which patches use it', () => {
    const { session, el, button, fixture } = setUp();
    const plum = button('Remove fabric Plum');
    expect(plum.getAttribute('aria-disabled') === 'true' || plum.disabled).toBe(true);
    const reason = el.querySelector(`#${plum.getAttribute('aria-describedby')}`);
    expect(reason?.textContent).toContain('In use by A1, A2');
    plum.click();
    expect(session.document().fabrics).toHaveLength(3);
    button('Remove fabric Sage').click();
    fixture.detectChanges();
    expect(session.document().fabrics.map((f) => f.id)).toEqual(['plum', 'oat']);
    expect(el.querySelector('li[aria-label="Sage"]')).toBeNull();
  });

  it('lists every strip set by section and patch, with a readable name until one is given', () => {
    const { session, el, type } = setUp();
    const input = el.querySelector<HTMLInputElement>('.strip-sets input')!;
    expect(input.placeholder).toBe('Strip set for A2');
    expect(el.querySelector('.strip-sets')?.textContent).toContain('Section A, patch A2');
    expect(el.querySelector('.strip-sets')?.textContent).not.toContain('t-k2x9');
    input.setAttribute('aria-label', 'strip set name');
    type('strip set name', 'Dawn stripes');
    expect(session.document().sections[0].patches[1].stripSet?.name).toBe('Dawn stripes');
    expect(buildCuttingList(session.document()).stripSets[0].name).toBe('Dawn stripes');
  });

  it('resizes the design: linked height, a preview of k, then areas × k² and a new cutting list', () => {
    const { session, el, button, byLabel, type } = setUp(readPatternDocument(buildGardenGate()));
    const before = session.document();
    type('New finished width', '10');
    expect(byLabel<HTMLInputElement>('New finished height').value).toBe('10');
    expect(el.querySelector('[data-testid="resize-preview"]')?.textContent).toContain('k = 1.25');
    expect(el.querySelector('[data-testid="resize-preview"]')?.textContent).toContain('areas × 1.5625');
    button('Apply new size').click();
    const after = session.document();
    expect(after.canvas).toEqual({ widthIn: 10, heightIn: 10 });
    expect(after.seamAllowanceIn).toBe(0.25);
    const area = (d: PatternDocument, label: string) => polygonArea(d.sections.flatMap((s) => derivePatches(s).patches).find((p) => p.label === label)!.polygon);
    // Straight sections only: areas scale exactly by k² = 1.5625 (standard mensuration).
    for (const label of ['A1', 'B1', 'C2']) expect(area(after, label) / area(before, label)).toBeCloseTo(1.5625, 9);
    // B1, a 2½ in. square, becomes 3⅛ in.: rough cut 3⅛ + 2 × (¼ + ½) = 4⅝ in. (was 4 in.).
    const b1 = buildCuttingList(after).patches.find((p) => p.patchLabel === 'B1')!;
    expect([b1.cutWidthIn, b1.cutLengthIn]).toEqual([4.625, 4.625]);
    session.undo();
    expect(session.document()).toEqual(before);
  });

  it('fits the design inside a size out of proportion, saying so', () => {
    const { session, el, button, type, fixture } = setUp(readPatternDocument(buildGardenGate()));
    el.querySelector<HTMLInputElement>('mat-checkbox input')!.click();
    fixture.detectChanges();
    type('New finished width', '16');
    type('New finished height', '12');
    const preview = el.querySelector('[data-testid="resize-preview"]')!.textContent!.replace(/\s+/g, ' ').trim();
    expect(preview).toBe('Everything scales by k = 1.5 (lengths × 1.5, areas × 2.25), to fit inside the new size; the drawing area becomes 16 in. × 12 in.');
    button('Apply new size').click();
    expect(session.document().canvas).toEqual({ widthIn: 16, heightIn: 12 });
    expect(session.document().sections[2].geometry).toMatchObject({ vertices: [{ x: 0, y: 8.25 }, { x: 12, y: 8.25 }, { x: 12, y: 12 }, { x: 0, y: 12 }] });
  });

  it('shows why a size cannot be applied and leaves the design as it was', () => {
    const { session, el, button, type, fixture } = setUp(readPatternDocument({ ...buildGardenGate(), canvas: { widthIn: 1, heightIn: 1 } }));
    type('New finished width', '150');
    button('Apply new size').click();
    fixture.detectChanges();
    const alert = el.querySelector('sw-resize-design [role="alert"]');
    expect(alert?.textContent).toContain('This size cannot be applied');
    expect(alert?.textContent).toMatch(/section [ABC]/);
    expect(session.document().canvas).toEqual({ widthIn: 1, heightIn: 1 });
    expect(session.canUndo()).toBe(false);
  });

  it('warns, as a status message, about sections outside the drawing area, by label', () => {
    const doc = pattern();
    const { el, session, fixture } = setUp(readPatternDocument({ ...doc, canvas: { widthIn: 4, heightIn: 8 } }));
    const status = el.querySelector('[role="status"]')!;
    expect(status.textContent).toContain('Outside the drawing area: section A (partly)');
    session.apply('Drawing area', (d) => ({ ...d, canvas: { widthIn: 12, heightIn: 12 } }));
    fixture.detectChanges();
    expect(status.textContent?.trim()).toBe('');
  });

  it('only shows values on a read-only board', () => {
    const { session, el, button } = setUp();
    session.editor.setReadOnly(true);
    TestBed.tick();
    expect(() => button('Add fabric')).toThrow();
    expect(() => button('Apply new size')).toThrow();
    expect([...el.querySelectorAll<HTMLInputElement>('input[matInput]')].every((i) => i.readOnly)).toBe(true);
  });
});
