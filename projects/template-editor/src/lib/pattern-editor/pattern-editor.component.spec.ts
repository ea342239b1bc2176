import { Component, input, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { DraftingBoardComponent } from '../board/drafting-board.component';
import { addSection } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { PatternEditorComponent } from './pattern-editor.component';

/** Konva cannot draw in jsdom: the board is replaced by an empty element of the same selector. */
@Component({ selector: 'sw-drafting-board', template: '' })
class BoardStub {
  readonly referenceImageUrl = input<string | null | undefined>(null);
  readonly highlight = input<unknown>(null);
}

@Component({
  imports: [PatternEditorComponent],
  template: `<sw-pattern-editor [document]="doc()" [readOnly]="readOnly()" (documentChange)="changes.push($event)" (dirtyChange)="dirty.push($event)" />`,
})
class HostComponent {
  readonly doc = signal<PatternDocument>(
    readPatternDocument({ formatVersion: 1, title: 'Host', canvas: { widthIn: 12, heightIn: 12 }, fabrics: [{ id: 'plum', name: 'Plum', colour: '#6b2d5c' }] }),
  );
  readonly readOnly = signal(false);
  readonly changes: PatternDocument[] = [];
  readonly dirty: boolean[] = [];
}

function setUp() {
  TestBed.overrideComponent(PatternEditorComponent, { remove: { imports: [DraftingBoardComponent] }, add: { imports: [BoardStub] } });
  const fixture = TestBed.createComponent(HostComponent);
  fixture.detectChanges();
  const editorEl = fixture.debugElement.children[0];
  const session = editorEl.injector.get(EditorSession);
  return { fixture, host: fixture.componentInstance, session, el: fixture.nativeElement as HTMLElement };
}

describe('PatternEditorComponent', () => {
  it('loads the input document without emitting or recording it', () => {
    const { host, session } = setUp();
    expect(session.document().title).toBe('Host');
    expect(host.changes).toEqual([]);
    expect(session.canUndo()).toBe(false);
  });

  it('emits each change and the dirty state, and undo back to the loaded document is clean', async () => {
    const { fixture, host, session, el } = setUp();
    session.apply('Add', (d) => addSection(d, { kind: 'wedge', centre: { x: 6, y: 6 }, radiusIn: 4, startAngleDeg: 0, sweepDeg: 45 }, session.editor.analysis).document);
    expect(host.changes).toHaveLength(1);
    expect(host.changes[0].sections[0].geometry.kind).toBe('wedge');
    expect(host.dirty).toEqual([true]);
    fixture.detectChanges();
    const undo = [...el.querySelectorAll('button')].find((b) => b.textContent?.trim() === 'Undo')!;
    undo.click();
    fixture.detectChanges();
    await fixture.whenStable();
    expect(host.changes).toHaveLength(2);
    expect(host.changes[1].sections).toHaveLength(0);
    expect(host.dirty).toEqual([true, false]);
  });

  it('emits a drag once, at its end', () => {
    const { host, session } = setUp();
    session.editor.store.beginGesture('Drag');
    for (let i = 2; i < 10; i++) session.editor.store.apply('Drag', (d) => ({ ...d, blockCount: i }));
    expect(host.changes).toHaveLength(0);
    session.editor.store.endGesture();
    expect(host.changes.map((d) => d.blockCount)).toEqual([9]);
  });

  it('hides the drawing tools on a read-only board and undo as well', () => {
    const { fixture, host, el } = setUp();
    host.readOnly.set(true);
    fixture.detectChanges();
    const tools = [...el.querySelectorAll('mat-button-toggle[data-tool]')].map((t) => t.getAttribute('data-tool'));
    expect(tools).toEqual(['select', 'pan']);
    expect([...el.querySelectorAll('button')].some((b) => b.textContent?.trim() === 'Undo')).toBe(false);
  });

  it('keeps the undo history when the saved copy of the same drawing comes back, and marks it saved', () => {
    const { fixture, host, session } = setUp();
    session.apply('Title', (d) => ({ ...d, title: 'Mine' }));
    host.doc.set(JSON.parse(JSON.stringify(session.document())));
    fixture.detectChanges();
    expect(session.canUndo()).toBe(true);
    expect(session.dirty()).toBe(false);
    expect(host.dirty).toEqual([true, false]);
  });

  it('takes a new document from the server as a load: history cleared, not dirty', () => {
    const { fixture, host, session } = setUp();
    session.apply('Title', (d) => ({ ...d, title: 'Mine' }));
    expect(session.canUndo()).toBe(true);
    host.doc.set({ ...host.doc(), title: 'Theirs' });
    fixture.detectChanges();
    expect(session.document().title).toBe('Theirs');
    expect(session.canUndo()).toBe(false);
    expect(session.dirty()).toBe(false);
  });
});
