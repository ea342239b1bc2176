import { describe, expect, it } from 'vitest';
import { addSection, findSection } from '../commands/section-commands';
import { testEditor } from '../testing/board-fixtures';
import type { BoardEditor } from './board-editor';

/** An editor with two arc sections (A, B), B selected; returns the messages its live region got. */
function boardWithB() {
  const ed = testEditor();
  let bId = '';
  ed.store.apply('Add', (d) => addSection(d, { kind: 'arc', centre: { x: 12, y: 12 }, innerRadiusIn: 2, outerRadiusIn: 4, startAngleDeg: 0, sweepDeg: 90 }, ed.analysis).document);
  ed.store.apply('Add', (d) => {
    const r = addSection(d, { kind: 'arc', centre: { x: 12, y: 12 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 45 }, ed.analysis);
    bId = r.sectionId;
    return r.document;
  });
  const messages: string[] = [];
  ed.onAnnounce((m) => messages.push(m));
  ed.store.select({ sectionId: bId, patchIndex: null });
  return { ed, bId, messages };
}

const centreOf = (ed: BoardEditor, id: string) => {
  const g = findSection(ed.store.document, id)!.geometry;
  return g.kind === 'straight' ? null : g.centre;
};

describe('the board’s keys on the selection', () => {
  it('arrows nudge by the snap step, Shift by 1 in.; each press is one undo step and is said in words', () => {
    const { ed, bId, messages } = boardWithB();
    expect(messages).toEqual(['Section B selected: arc section, 1 patch']);
    const depth = ed.store.undoDepth;
    expect(ed.keyDown({ key: 'ArrowRight' })).toBe(true);
    expect(centreOf(ed, bId)).toEqual({ x: 12.125, y: 12 });
    expect(ed.store.undoDepth).toBe(depth + 1);
    expect(messages.at(-1)).toBe('Section B moved ⅛ in. right');
    expect(ed.keyDown({ key: 'ArrowDown', shiftKey: true })).toBe(true);
    expect(centreOf(ed, bId)).toEqual({ x: 12.125, y: 13 });
    expect(ed.store.undoDepth).toBe(depth + 2);
    expect(messages.at(-1)).toBe('Section B moved 1 in. down');
    ed.keyDown({ key: 'z', ctrlKey: true });
    expect(centreOf(ed, bId)).toEqual({ x: 12.125, y: 12 });
    expect(messages.at(-1)).toBe('Undone: move section B');
    ed.keyDown({ key: 'z', ctrlKey: true });
    expect(centreOf(ed, bId)).toEqual({ x: 12, y: 12 });
    ed.keyDown({ key: 'Z', ctrlKey: true, shiftKey: true });
    expect(centreOf(ed, bId)).toEqual({ x: 12.125, y: 12 });
    expect(messages.at(-1)).toBe('Redone: move section B');
  });

  it('follows the grid setting and the metric board', () => {
    const { ed, bId, messages } = boardWithB();
    ed.setSettings({ grid: 'quarter-in' });
    ed.keyDown({ key: 'ArrowLeft' });
    expect(centreOf(ed, bId)).toEqual({ x: 11.75, y: 12 });
    expect(messages.at(-1)).toBe('Section B moved ¼ in. left');
    ed.setSettings({ unit: 'cm', grid: 'half-cm' });
    ed.keyDown({ key: 'ArrowUp', shiftKey: true });
    expect(centreOf(ed, bId)!.y).toBeCloseTo(12 - 1 / 2.54, 12);
    expect(messages.at(-1)).toBe('Section B moved 1 cm up');
  });

  it('Delete removes the selection in one step, Escape clears it; with nothing selected the keys pass', () => {
    const { ed, bId, messages } = boardWithB();
    expect(ed.keyDown({ key: 'Escape' })).toBe(true);
    expect(ed.store.selection.sectionId).toBeNull();
    expect(messages.at(-1)).toBe('Nothing selected');
    expect(ed.keyDown({ key: 'ArrowRight' })).toBe(false);
    ed.store.select({ sectionId: bId, patchIndex: 0 });
    expect(messages.at(-1)).toBe('Patch B1 selected');
    const depth = ed.store.undoDepth;
    expect(ed.keyDown({ key: 'Delete' })).toBe(true);
    expect(ed.store.document.sections.map((s) => s.label)).toEqual(['A']);
    expect(ed.store.undoDepth).toBe(depth + 1);
    expect(messages.at(-1)).toBe('Section B deleted');
    ed.undo();
    expect(ed.store.document.sections.map((s) => s.label)).toEqual(['A', 'B']);
    expect(messages.at(-1)).toBe('Undone: delete section B');
  });

  it('leaves the keys to a tool that is half way through, and to a read-only board does nothing', () => {
    const { ed, bId } = boardWithB();
    ed.setTool('straight');
    ed.pointerDown({ x: 100, y: 100 });
    ed.pointerUp({ x: 100, y: 100 });
    expect(ed.tool.state).toBe('placing');
    ed.keyDown({ key: 'ArrowRight' });
    expect(centreOf(ed, bId)).toEqual({ x: 12, y: 12 });
    ed.keyDown({ key: 'Escape' });
    expect(ed.tool.state).toBe('idle');
    expect(ed.store.selection.sectionId).toBe(bId);
    ed.setReadOnly(true);
    expect(ed.keyDown({ key: 'ArrowRight' })).toBe(false);
    expect(centreOf(ed, bId)).toEqual({ x: 12, y: 12 });
  });
});

describe('what the board says about the selection', () => {
  it('says the first selection after opening a pattern, and nothing for the load itself', () => {
    const { ed, bId } = boardWithB();
    const doc = ed.store.document;
    ed.store.load(doc);
    const messages: string[] = [];
    ed.onAnnounce((m) => messages.push(m));
    ed.store.load({ ...doc, sections: doc.sections.filter((s) => s.id !== bId) });
    expect(messages).toEqual([]);
    ed.store.select({ sectionId: doc.sections[0].id, patchIndex: null });
    expect(messages).toEqual(['Section A selected: arc section, 1 patch']);
  });
});
