import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { readPatternDocument } from '@seamwright/piecing';
import { addSeam, addSection } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { SectionsOutlineComponent } from './sections-outline.component';

@Component({
  imports: [SectionsOutlineComponent],
  providers: [EditorSession],
  template: `<sw-sections-outline />`,
})
class HostComponent {}

/** An editor holding a wedge A and an arc B split by three radial seams into four patches. */
function setUp() {
  const fixture = TestBed.createComponent(HostComponent);
  const session = fixture.debugElement.injector.get(EditorSession);
  const a = session.editor.analysis;
  let doc = readPatternDocument({ formatVersion: 1, title: 'Outline', canvas: { widthIn: 24, heightIn: 24 }, fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b2d5c' }] });
  doc = addSection(doc, { kind: 'wedge', centre: { x: 12, y: 12 }, radiusIn: 4, startAngleDeg: 180, sweepDeg: 90 }, a).document;
  const b = addSection(doc, { kind: 'arc', centre: { x: 12, y: 12 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 90 }, a);
  doc = b.document;
  for (const deg of [22.5, 45, 67.5]) {
    const r = (deg * Math.PI) / 180;
    doc = addSeam(doc, b.sectionId, { x: 12 + 5 * Math.cos(r), y: 12 + 5 * Math.sin(r) }, { x: 12 + 8 * Math.cos(r), y: 12 + 8 * Math.sin(r) }, a);
  }
  session.load(doc);
  fixture.detectChanges();
  const el = fixture.nativeElement as HTMLElement;
  document.body.appendChild(el);
  const tree = () => el.querySelector('[role="tree"]') as HTMLElement;
  const items = () => [...el.querySelectorAll<HTMLElement>('[role="treeitem"]')];
  const names = () => items().map((i) => i.getAttribute('aria-label') ?? i.textContent!.trim());
  const focused = () => document.activeElement as HTMLElement;
  const focusedName = () => focused().getAttribute('aria-label') ?? focused().textContent!.trim();
  const press = (key: string) => {
    focused().dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true }));
    fixture.detectChanges();
  };
  return { fixture, session, bId: b.sectionId, el, tree, items, names, focused, focusedName, press };
}

describe('SectionsOutlineComponent', () => {
  afterEach(() => document.body.replaceChildren());

  it('is a tree named Sections: one item per section with its patches as child items', () => {
    const { tree, items, names } = setUp();
    expect(tree().getAttribute('aria-label')).toBe('Sections');
    expect(names()).toEqual(['A, wedge section, 1 patch', 'A1', 'B, arc section, 4 patches', 'B1', 'B2', 'B3', 'B4']);
    expect(items().map((i) => i.getAttribute('aria-level'))).toEqual(['1', '2', '1', '2', '2', '2', '2']);
    expect(items()[2].getAttribute('aria-expanded')).toBe('true');
    // One Tab stop: the first item until something else is current.
    expect(items().map((i) => i.getAttribute('tabindex'))).toEqual(['0', '-1', '-1', '-1', '-1', '-1', '-1']);
    expect(items().every((i) => i.getAttribute('aria-selected') === 'false')).toBe(true);
  });

  it('moves with the arrow keys, Home and End; Left closes a section and goes back to it, Right opens and enters it', () => {
    const { items, names, focusedName, press } = setUp();
    items()[0].focus();
    press('ArrowDown');
    expect(focusedName()).toBe('A1');
    press('ArrowDown');
    expect(focusedName()).toBe('B, arc section, 4 patches');
    press('End');
    expect(focusedName()).toBe('B4');
    press('ArrowLeft');
    expect(focusedName()).toBe('B, arc section, 4 patches');
    press('ArrowLeft');
    expect(names()).toEqual(['A, wedge section, 1 patch', 'A1', 'B, arc section, 4 patches']);
    expect(items()[2].getAttribute('aria-expanded')).toBe('false');
    press('ArrowRight');
    expect(names()).toHaveLength(7);
    expect(focusedName()).toBe('B, arc section, 4 patches');
    press('ArrowRight');
    expect(focusedName()).toBe('B1');
    press('Home');
    expect(focusedName()).toBe('A, wedge section, 1 patch');
    press('ArrowUp');
    expect(focusedName()).toBe('A, wedge section, 1 patch');
    expect(items().filter((i) => i.getAttribute('tabindex') === '0')).toHaveLength(1);
  });

  it('Enter selects the item on the board and keeps focus in the outline', () => {
    const { session, bId, items, focusedName, press } = setUp();
    items()[0].focus();
    press('ArrowDown');
    press('ArrowDown');
    press('Enter');
    expect(session.selection()).toEqual({ sectionId: bId, patchIndex: null });
    expect(focusedName()).toBe('B, arc section, 4 patches');
    expect(items()[2].getAttribute('aria-selected')).toBe('true');
    press('ArrowRight');
    press('ArrowDown');
    press('Enter');
    const patch = session.selectedPatches().find((p) => p.label === 'B2')!;
    expect(session.selection()).toEqual({ sectionId: bId, patchIndex: patch.index });
    expect(focusedName()).toBe('B2');
    expect(items().filter((i) => i.getAttribute('aria-selected') === 'true').map((i) => i.textContent!.trim())).toEqual(['B2']);
  });

  it('follows a selection made on the board: the current item moves there, opening its section', () => {
    const { fixture, session, bId, items, press } = setUp();
    items()[0].focus();
    press('End');
    press('ArrowLeft');
    press('ArrowLeft'); // B closed
    const b3 = session.editor.analysis.patches(session.document().sections[1]).find((p) => p.label === 'B3')!;
    session.editor.store.select({ sectionId: bId, patchIndex: b3.index });
    fixture.detectChanges();
    const current = items().filter((i) => i.getAttribute('tabindex') === '0');
    expect(current.map((i) => i.textContent!.trim())).toEqual(['B3']);
    expect(current[0].getAttribute('aria-selected')).toBe('true');
    session.editor.store.select({ sectionId: session.document().sections[0].id, patchIndex: null });
    fixture.detectChanges();
    expect(items().filter((i) => i.getAttribute('tabindex') === '0').map((i) => i.getAttribute('aria-label'))).toEqual(['A, wedge section, 1 patch']);
  });

  it('names a patch’s fabric', () => {
    const { fixture, session, bId, names } = setUp();
    const b1 = session.editor.analysis.patches(session.document().sections[1]).find((p) => p.label === 'B1')!;
    session.editor.store.select({ sectionId: bId, patchIndex: b1.index });
    fixture.detectChanges();
    session.apply('Fill', (d) => ({ ...d, sections: d.sections.map((s) => (s.id === bId ? { ...s, patches: s.patches.map((p) => (p.number === 1 ? { ...p, fabricId: 'plum' } : p)) } : s)) }));
    fixture.detectChanges();
    expect(names()).toContain('B1, Plum');
  });
});
