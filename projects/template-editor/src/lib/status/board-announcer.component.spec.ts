import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { readPatternDocument } from '@seamwright/piecing';
import { addSeam, addSection } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { BoardAnnouncerComponent } from './board-announcer.component';

@Component({
  imports: [BoardAnnouncerComponent],
  providers: [EditorSession],
  template: `<sw-board-announcer />`,
})
class HostComponent {}

function setUp() {
  const fixture = TestBed.createComponent(HostComponent);
  const session = fixture.debugElement.injector.get(EditorSession);
  const a = session.editor.analysis;
  let doc = readPatternDocument({ formatVersion: 1, title: 'Said', canvas: { widthIn: 24, heightIn: 24 } });
  doc = addSection(doc, { kind: 'wedge', centre: { x: 12, y: 12 }, radiusIn: 4, startAngleDeg: 180, sweepDeg: 90 }, a).document;
  const b = addSection(doc, { kind: 'arc', centre: { x: 12, y: 12 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 90 }, a);
  doc = addSeam(b.document, b.sectionId, { x: 12 + 5 * Math.SQRT1_2, y: 12 + 5 * Math.SQRT1_2 }, { x: 12 + 8 * Math.SQRT1_2, y: 12 + 8 * Math.SQRT1_2 }, a);
  session.load(doc);
  fixture.detectChanges();
  const region = () => (fixture.nativeElement as HTMLElement).querySelector('[aria-live]') as HTMLElement;
  const said = () => {
    fixture.detectChanges();
    return region().textContent!.replace(/\u00a0/g, '').trim();
  };
  return { fixture, session, bId: b.sectionId, region, said };
}

describe('BoardAnnouncerComponent', () => {
  it('is one polite, atomic live region that starts silent', () => {
    const { fixture, said, region } = setUp();
    expect((fixture.nativeElement as HTMLElement).querySelectorAll('[aria-live]')).toHaveLength(1);
    expect(region().getAttribute('aria-live')).toBe('polite');
    expect(region().getAttribute('aria-atomic')).toBe('true');
    expect(said()).toBe('');
  });

  it('says what is selected, what each board key did, and what undo and redo took back', () => {
    const { session, bId, said } = setUp();
    session.editor.store.select({ sectionId: bId, patchIndex: null });
    expect(said()).toBe('Section B selected: arc section, 2 patches');
    session.editor.keyDown({ key: 'ArrowRight' });
    expect(said()).toBe('Section B moved ⅛ in. right');
    session.editor.keyDown({ key: 'ArrowUp', shiftKey: true });
    expect(said()).toBe('Section B moved 1 in. up');
    session.editor.keyDown({ key: 'z', ctrlKey: true });
    expect(said()).toBe('Undone: move section B');
    session.editor.keyDown({ key: 'y', ctrlKey: true });
    expect(said()).toBe('Redone: move section B');
    const b2 = session.selectedPatches().find((p) => p.label === 'B2')!;
    session.editor.store.select({ sectionId: bId, patchIndex: b2.index });
    expect(said()).toBe('Patch B2 selected');
    session.editor.keyDown({ key: 'Delete' });
    expect(said()).toBe('Section B deleted');
    session.editor.keyDown({ key: 'z', ctrlKey: true });
    expect(said()).toBe('Undone: delete section B');
  });

  it('says the tool picked and what it wants next', () => {
    const { session, said } = setUp();
    session.editor.keyDown({ key: 'l' });
    expect(said()).toBe('Split tool: Press on a patch edge to start a seam');
  });

  it('says the same message again when a key does the same thing twice (the text changes)', () => {
    const { session, bId, region, said } = setUp();
    session.editor.store.select({ sectionId: bId, patchIndex: null });
    session.editor.keyDown({ key: 'ArrowLeft' });
    said();
    const first = region().textContent;
    session.editor.keyDown({ key: 'ArrowLeft' });
    said();
    expect(region().textContent).not.toBe(first);
    expect(said()).toBe('Section B moved ⅛ in. left');
  });
});
