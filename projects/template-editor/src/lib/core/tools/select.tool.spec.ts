import { describe, expect, it } from 'vitest';
import { click, play, testEditor } from '../testing/board-fixtures';

function withSquare() {
  const ed = testEditor();
  ed.setTool('straight');
  play(ed, [...click(2, 2), ...click(6, 2), ...click(6, 6), ...click(2, 6)]);
  ed.keyDown({ key: 'Enter' });
  ed.setTool('select');
  return ed;
}

describe('Select tool', () => {
  it('drags a vertex of the selected section, snapping to the grid, as one undo step', () => {
    const ed = withSquare();
    play(ed, click(4, 4));
    expect(ed.store.selection.sectionId).toBe(ed.store.document.sections[0].id);
    const depth = ed.store.undoDepth;
    play(ed, [['down', 6, 6], ['move', 6.5, 6.3], ['move', 7.02, 7.1]]);
    expect(ed.tool.state).toBe('dragging-handle');
    play(ed, [['move', 7.52, 8.07], ['up', 7.52, 8.07]]);
    expect(ed.tool.state).toBe('idle');
    const g = ed.store.document.sections[0].geometry;
    expect(g.kind === 'straight' && g.vertices[2]).toEqual({ x: 7.5, y: 8.125 });
    expect(ed.store.undoDepth).toBe(depth + 1);
    ed.keyDown({ key: 'z', ctrlKey: true });
    const back = ed.store.document.sections[0].geometry;
    expect(back.kind === 'straight' && back.vertices[2]).toEqual({ x: 6, y: 6 });
    ed.keyDown({ key: 'y', ctrlKey: true });
    const again = ed.store.document.sections[0].geometry;
    expect(again.kind === 'straight' && again.vertices[2]).toEqual({ x: 7.5, y: 8.125 });
  });

  it('moves a whole section with its seams by whole grid steps', () => {
    const ed = withSquare();
    ed.setTool('split');
    play(ed, [['down', 4, 2], ['move', 4, 4], ['up', 4, 6]]);
    ed.setTool('select');
    play(ed, [['down', 3, 3], ['move', 3.6, 3.3], ['move', 4.01, 4.02], ['up', 4.01, 4.02]]);
    const s = ed.store.document.sections[0];
    expect(s.geometry.kind === 'straight' && s.geometry.vertices[0]).toEqual({ x: 3, y: 3 });
    expect(s.seams[0].a).toEqual({ x: 5, y: 3 });
    expect(ed.analysis.patches(s)).toHaveLength(2);
  });

  it('reshapes an arc section by its handles: outer radius, then end angle', () => {
    const ed = testEditor();
    ed.setTool('arc');
    play(ed, [['down', 12, 12], ['move', 20, 12], ['up', 20, 12], ...click(17, 12), ...click(12, 20)]);
    ed.setTool('select');
    ed.setSettings({ grid: 'off', snapToPoints: false });
    // The outer-radius handle sits on the outer arc at mid-sweep (45°).
    const r = 8 * Math.SQRT1_2;
    play(ed, [['down', 12 + r, 12 + r], ['move', 12 + 9 * Math.SQRT1_2, 12 + 9 * Math.SQRT1_2], ['up', 12 + 9 * Math.SQRT1_2, 12 + 9 * Math.SQRT1_2]]);
    let g = ed.store.document.sections[0].geometry;
    expect(g.kind === 'arc' && g.outerRadiusIn).toBeCloseTo(9, 9);
    // The end handle is at 90° on the outer arc; drag it round to 60°.
    const end60 = { x: 12 + 9 * Math.cos(Math.PI / 3), y: 12 + 9 * Math.sin(Math.PI / 3) };
    play(ed, [['down', 12, 21], ['move', end60.x, end60.y], ['up', end60.x, end60.y]]);
    g = ed.store.document.sections[0].geometry;
    expect(g.kind === 'arc' && g.sweepDeg).toBeCloseTo(60, 9);
    expect(ed.store.undoDepth).toBe(3);
  });

  it('clears the selection on a click on empty board and deletes the selection with Delete', () => {
    const ed = withSquare();
    play(ed, click(4, 4));
    play(ed, click(15, 15));
    expect(ed.store.selection).toEqual({ sectionId: null, patchIndex: null });
    play(ed, click(4, 4));
    ed.keyDown({ key: 'Delete' });
    expect(ed.store.document.sections).toHaveLength(0);
  });
});
