import { describe, expect, it } from 'vitest';
import { click, play, polar, testEditor } from '../testing/board-fixtures';
import type { ArcSectionTool } from './arc-section.tool';

describe('Straight section tool', () => {
  it('adds a section from clicked corners, closed by clicking the first one again', () => {
    const ed = testEditor();
    ed.setTool('straight');
    // 1.02 snaps to 1 on the ⅛ in. grid.
    play(ed, [...click(1.02, 1), ...click(4, 1)]);
    expect(ed.tool.state).toBe('placing');
    expect(ed.tool.preview()).toEqual({ kind: 'polyline', points: [{ x: 1, y: 1 }, { x: 4, y: 1 }, { x: 4, y: 1 }], closed: false });
    play(ed, [...click(4, 3.9), ...click(1, 4), ...click(1.01, 1.01)]);
    expect(ed.tool.state).toBe('idle');
    const doc = ed.store.document;
    expect(doc.sections).toHaveLength(1);
    expect(doc.sections[0].label).toBe('A');
    expect(doc.sections[0].geometry).toEqual({ kind: 'straight', vertices: [{ x: 1, y: 1 }, { x: 4, y: 1 }, { x: 4, y: 3.875 }, { x: 1, y: 4 }] });
    expect(doc.sections[0].patches).toHaveLength(1);
    expect(ed.store.selection.sectionId).toBe(doc.sections[0].id);
    expect(ed.store.undoDepth).toBe(1);
  });

  it('takes back the last corner with Backspace, closes with Enter and drops with Escape', () => {
    const ed = testEditor();
    ed.setTool('straight');
    play(ed, [...click(0, 0), ...click(2, 0), ...click(5, 5)]);
    ed.keyDown({ key: 'Backspace' });
    play(ed, click(2, 2));
    ed.keyDown({ key: 'Enter' });
    expect(ed.store.document.sections[0].geometry).toEqual({ kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }] });
    play(ed, [...click(6, 6), ...click(7, 6)]);
    ed.keyDown({ key: 'Escape' });
    expect(ed.tool.state).toBe('idle');
    ed.keyDown({ key: 'Enter' });
    expect(ed.store.document.sections).toHaveLength(1);
  });
});

describe('Arc section tool', () => {
  it('goes centre → outer radius → inner radius → sweep and adds the arc section', () => {
    const ed = testEditor();
    ed.setTool('arc');
    const c = { x: 12, y: 12 };
    play(ed, [['down', 12, 12], ['move', 16, 12], ['move', 20, 12]]);
    expect(ed.tool.state).toBe('outer');
    play(ed, [['up', 20, 12]]);
    expect(ed.tool.state).toBe('inner');
    play(ed, [['move', 17, 12], ...click(17, 12)]);
    expect(ed.tool.state).toBe('sweep');
    const end = polar(c, 6, 90);
    play(ed, [['move', end.x, end.y]]);
    expect(ed.tool.preview()).toMatchObject({ kind: 'geometry', geometry: { kind: 'arc', outerRadiusIn: 8, innerRadiusIn: 5, startAngleDeg: 0, sweepDeg: 90 } });
    play(ed, click(end.x, end.y));
    expect(ed.tool.state).toBe('idle');
    const s = ed.store.document.sections[0];
    expect(s.geometry).toEqual({ kind: 'arc', centre: c, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 90 });
    // Annular sector area θ(R² − r²)/2 (CRC Standard Mathematical Tables): π/2 · (64 − 25) / 2 = 30.63 sq in.
    const patch = ed.analysis.patches(s)[0];
    let twice = 0;
    for (let i = 0; i < patch.polygon.length; i++) {
      const a = patch.polygon[i];
      const b = patch.polygon[(i + 1) % patch.polygon.length];
      twice += a.x * b.y - b.x * a.y;
    }
    expect(Math.abs(twice) / 2).toBeCloseTo((Math.PI / 2) * (64 - 25) / 2, 1);
  });

  it('adds an arc from typed numbers and explains numbers that make none', () => {
    const ed = testEditor();
    ed.setTool('arc');
    const tool = ed.tool as ArcSectionTool;
    const bad = tool.commitTyped({ centre: { x: 12, y: 12 }, innerRadiusIn: 8, outerRadiusIn: 5, startAngleDeg: 0, sweepDeg: 45 });
    expect(bad).toEqual({ ok: false, message: 'innerRadiusIn: inner radius must be smaller than outer radius' });
    expect(ed.store.document.sections).toHaveLength(0);
    const good = tool.commitTyped({ centre: { x: 12, y: 12 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 22.5, sweepDeg: 45 });
    expect(good.ok).toBe(true);
    expect(ed.store.document.sections[0].geometry).toMatchObject({ kind: 'arc', startAngleDeg: 22.5, sweepDeg: 45 });
  });

  it('drops a half-drawn arc on Escape', () => {
    const ed = testEditor();
    ed.setTool('arc');
    play(ed, [['down', 12, 12], ['move', 15, 12], ['up', 15, 12]]);
    ed.keyDown({ key: 'Escape' });
    expect(ed.tool.state).toBe('idle');
    expect(ed.tool.preview()).toBeNull();
    expect(ed.store.document.sections).toHaveLength(0);
  });
});

describe('Wedge section tool', () => {
  it('goes centre → radius → sweep and adds the wedge', () => {
    const ed = testEditor();
    ed.setTool('wedge');
    play(ed, [['down', 12, 12], ['move', 14, 12], ['up', 17, 12]]);
    expect(ed.tool.state).toBe('sweep');
    const end = polar({ x: 12, y: 12 }, 5, 45);
    play(ed, [['move', end.x, end.y]]);
    expect(ed.tool.state).toBe('sweep');
    // 45° of the ⅛ in. grid: the end point snaps, so the angle is near 45°.
    ed.setSettings({ grid: 'off' });
    play(ed, click(end.x, end.y));
    const g = ed.store.document.sections[0].geometry;
    expect(g).toMatchObject({ kind: 'wedge', centre: { x: 12, y: 12 }, radiusIn: 5, startAngleDeg: 0 });
    expect(g.kind === 'wedge' && g.sweepDeg).toBeCloseTo(45, 9);
  });
});

describe('Angle snapping while drawing', () => {
  const C = { x: 12, y: 12 };

  it('snaps a mouse-drawn wedge to 7.5° steps, and leaves it as drawn with angle snapping off', () => {
    const ed = testEditor();
    ed.setSettings({ grid: 'off', snapToPoints: false });
    ed.setTool('wedge');
    // Press at the centre, drag out to 6 in. at 247.38°, then click the end at 247.38° + 61.2°.
    play(ed, [['down', C.x, C.y], ['move', polar(C, 6, 247.38).x, polar(C, 6, 247.38).y], ['up', polar(C, 6, 247.38).x, polar(C, 6, 247.38).y]]);
    const end = polar(C, 6, 247.38 + 61.2);
    play(ed, [['move', end.x, end.y], ...click(end.x, end.y)]);
    const g = ed.store.document.sections[0].geometry;
    expect(g.kind === 'wedge' && [g.startAngleDeg, g.sweepDeg]).toEqual([247.5, 60]);

    const raw = testEditor();
    raw.setSettings({ grid: 'off', snapToPoints: false, snapAngles: false });
    raw.setTool('wedge');
    play(raw, [['down', C.x, C.y], ['move', polar(C, 6, 247.38).x, polar(C, 6, 247.38).y], ['up', polar(C, 6, 247.38).x, polar(C, 6, 247.38).y]]);
    play(raw, [['move', end.x, end.y], ...click(end.x, end.y)]);
    const r = raw.store.document.sections[0].geometry;
    expect(r.kind === 'wedge' && r.startAngleDeg).toBeCloseTo(247.38, 6);
  });

  it('snaps to the divisions of a ring repeat around the same centre (360/7)', () => {
    const ed = testEditor();
    ed.setSettings({ grid: 'off', snapToPoints: false, ringCount: 7 });
    ed.setTool('arc');
    const out = polar(C, 8, 52);
    play(ed, [['down', C.x, C.y], ['move', out.x, out.y], ['up', out.x, out.y]]);
    play(ed, click(polar(C, 5, 52).x, polar(C, 5, 52).y));
    const end = polar(C, 6.5, 52 + 50.9);
    play(ed, [['move', end.x, end.y], ...click(end.x, end.y)]);
    const g = ed.store.document.sections[0].geometry;
    if (g.kind !== 'arc') throw new Error('expected an arc');
    expect(g.startAngleDeg).toBeCloseTo(360 / 7, 9);
    expect(g.sweepDeg).toBeCloseTo(360 / 7, 9);
  });

  it('snaps the end handle of a selected wedge to a 7.5° sweep', () => {
    const ed = testEditor();
    ed.setSettings({ grid: 'off', snapToPoints: false });
    ed.setTool('wedge');
    play(ed, [['down', C.x, C.y], ['move', C.x + 6, C.y], ['up', C.x + 6, C.y]]);
    play(ed, [['move', C.x, C.y + 6], ...click(C.x, C.y + 6)]);
    ed.setTool('select');
    const from = polar(C, 6, 90);
    const to = polar(C, 6, 121.3);
    play(ed, [['down', from.x, from.y], ['move', to.x, to.y], ['up', to.x, to.y]]);
    const g = ed.store.document.sections[0].geometry;
    expect(g.kind === 'wedge' && [g.startAngleDeg, g.sweepDeg]).toEqual([0, 120]);
  });
});
