import { describe, expect, it } from 'vitest';
import { click, play, testEditor } from '../testing/board-fixtures';
import { toDocument, toScreen } from '../view/viewport';

describe('BoardEditor', () => {
  it('picks tools by their keys and ignores them with Ctrl held', () => {
    const ed = testEditor();
    const expected: Record<string, string> = { s: 'straight', a: 'arc', w: 'wedge', l: 'split', r: 'ring', f: 'fill', t: 'strip-set', n: 'renumber', d: 'delete', h: 'pan', v: 'select' };
    for (const [key, id] of Object.entries(expected)) {
      expect(ed.keyDown({ key })).toBe(true);
      expect(ed.tool.id).toBe(id);
    }
    ed.keyDown({ key: 'a', ctrlKey: true });
    expect(ed.tool.id).toBe('select');
  });

  it('zooms about the cursor: the point under it stays under it', () => {
    const ed = testEditor();
    const cursor = { x: 530, y: 270 };
    const before = toDocument(ed.viewport, cursor);
    ed.wheel(cursor, -240);
    expect(ed.viewport.scale).toBeGreaterThan(100);
    const after = toDocument(ed.viewport, cursor);
    expect(after.x).toBeCloseTo(before.x, 9);
    expect(after.y).toBeCloseTo(before.y, 9);
  });

  it('keeps scale and offset when the board is resized: the point under the pointer stays put', () => {
    const ed = testEditor();
    const view = { ...ed.viewport };
    const pointer = { x: 300, y: 200 };
    const under = toDocument(ed.viewport, pointer);
    for (const [w, h] of [[1200, 300], [640, 900], [2400, 2400]]) {
      ed.setSize(w, h);
      expect(ed.viewport).toEqual(view);
      expect(toDocument(ed.viewport, pointer)).toEqual(under);
    }
  });

  it('zooms with + and − about the pointer, or the middle of the board when the pointer is off it; 0 fits', () => {
    const ed = testEditor();
    ed.setSize(1000, 600);
    const pointer = { x: 250, y: 410 };
    ed.pointerMove(pointer);
    const under = toDocument(ed.viewport, pointer);
    expect(ed.keyDown({ key: '+' })).toBe(true);
    expect(ed.viewport.scale).toBeCloseTo(125, 9);
    expect(toDocument(ed.viewport, pointer).x).toBeCloseTo(under.x, 9);
    expect(toDocument(ed.viewport, pointer).y).toBeCloseTo(under.y, 9);
    ed.pointerLeave();
    const middle = toDocument(ed.viewport, { x: 500, y: 300 });
    expect(ed.keyDown({ key: '-' })).toBe(true);
    expect(ed.viewport.scale).toBeCloseTo(100, 9);
    expect(toDocument(ed.viewport, { x: 500, y: 300 }).x).toBeCloseTo(middle.x, 9);
    expect(ed.keyDown({ key: '0' })).toBe(true);
    // The empty 24 in. drawing area in 600 − 2 · 40 px of height: 520 / 24 px per inch.
    expect(ed.viewport.scale).toBeCloseTo(520 / 24, 9);
  });

  it('fits the drawing area and the sections into the view', () => {
    const ed = testEditor();
    ed.setSize(1000, 500);
    ed.fitToContent(50);
    // 24 in. high area into 500 − 2·50 px: 400/24 px per inch, centred.
    expect(ed.viewport.scale).toBeCloseTo(400 / 24, 9);
    const topLeft = toScreen(ed.viewport, { x: 0, y: 0 });
    const bottomRight = toScreen(ed.viewport, { x: 24, y: 24 });
    expect(topLeft.y).toBeCloseTo(50, 9);
    expect((topLeft.x + bottomRight.x) / 2).toBeCloseTo(500, 9);
  });

  it('pans with the middle button without touching the document', () => {
    const ed = testEditor();
    const doc = ed.store.document;
    ed.pointerDown({ x: 100, y: 100 }, { button: 1 });
    ed.pointerMove({ x: 160, y: 130 });
    ed.pointerUp({ x: 160, y: 130 });
    expect(ed.viewport.originX).toBe(60);
    expect(ed.viewport.originY).toBe(30);
    expect(ed.store.document).toBe(doc);
  });

  it('maps the pointer through the mirrored view, so drawing still lands where the cursor is', () => {
    const ed = testEditor();
    ed.setSettings({ mirrored: true });
    const s = toScreen(ed.viewport, { x: 3, y: 5 });
    expect(s.x).toBeCloseTo((24 - 3) * 100, 9);
    ed.setTool('straight');
    play(ed, [...click(3, 5), ...click(6, 5), ...click(6, 8)]);
    ed.keyDown({ key: 'Enter' });
    const g = ed.store.document.sections[0].geometry;
    expect(g.kind === 'straight' && g.vertices).toEqual([{ x: 3, y: 5 }, { x: 6, y: 5 }, { x: 6, y: 8 }]);
  });

  it('copies and pastes a section with a new label, moved by ½ in., as one undo step', () => {
    const ed = testEditor();
    ed.setTool('straight');
    play(ed, [...click(1, 1), ...click(3, 1), ...click(3, 3)]);
    ed.keyDown({ key: 'Enter' });
    ed.keyDown({ key: 'c', ctrlKey: true });
    ed.keyDown({ key: 'v', ctrlKey: true });
    ed.keyDown({ key: 'v', ctrlKey: true });
    const [a, b, c] = ed.store.document.sections;
    expect([a.label, b.label, c.label]).toEqual(['A', 'B', 'C']);
    expect(new Set([a.id, b.id, c.id]).size).toBe(3);
    expect(b.geometry.kind === 'straight' && b.geometry.vertices[0]).toEqual({ x: 1.5, y: 1.5 });
    expect(c.geometry.kind === 'straight' && c.geometry.vertices[0]).toEqual({ x: 2, y: 2 });
    expect(ed.store.selection.sectionId).toBe(c.id);
    ed.undo();
    expect(ed.store.document.sections).toHaveLength(2);
  });

  it('keeps a read-only board to selecting and panning', () => {
    const ed = testEditor();
    ed.setReadOnly(true);
    ed.keyDown({ key: 's' });
    expect(ed.tool.id).toBe('select');
    ed.keyDown({ key: 'h' });
    expect(ed.tool.id).toBe('pan');
  });
});
