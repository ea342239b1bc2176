import { describe, expect, it } from 'vitest';
import { SectionAnalysis } from '../analysis/section-analysis';
import { click, emptyPattern, play, testEditor } from '../testing/board-fixtures';
import { addSeamByValues, addSectionByValues } from './typed-entry';

describe('drawing by typed values', () => {
  it('adds the same straight section the straight tool draws from the same corners', () => {
    const corners = [{ x: 2, y: 2 }, { x: 10, y: 2 }, { x: 10, y: 10 }, { x: 2, y: 10 }];
    const drawn = testEditor();
    drawn.setTool('straight');
    play(drawn, [...corners.flatMap((p) => click(p.x, p.y)), ...click(2, 2)]);
    const typed = testEditor();
    const r = typed.addSectionByValues({ kind: 'straight', vertices: corners });
    expect(r.ok).toBe(true);
    expect(typed.store.document.sections.map((s) => [s.label, s.geometry])).toEqual(drawn.store.document.sections.map((s) => [s.label, s.geometry]));
    expect(typed.store.selection.sectionId).toBe(typed.store.document.sections[0].id);
    expect(typed.store.undoDepth).toBe(1);
  });

  it('refuses values the document schema refuses, in words', () => {
    const r = addSectionByValues(emptyPattern(), { kind: 'arc', centre: { x: 6, y: 6 }, innerRadiusIn: 5, outerRadiusIn: 3, startAngleDeg: 0, sweepDeg: 90 }, new SectionAnalysis(), true);
    expect(r.ok).toBe(false);
    const two = addSectionByValues(emptyPattern(), { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 1, y: 0 }] }, new SectionAnalysis(), true);
    expect(two.ok === false && two.message).toMatch(/^vertices: /);
  });

  it('adds a seam from two typed ends, an end near an edge going exactly onto it; a seam that splits nothing is refused', () => {
    const ed = testEditor();
    ed.addSectionByValues({ kind: 'straight', vertices: [{ x: 2, y: 2 }, { x: 10, y: 2 }, { x: 10, y: 10 }, { x: 2, y: 10 }] });
    const id = ed.store.selection.sectionId!;
    // 1/32 in. short of the top edge: caught and put on it.
    const r = ed.addSeamByValues({ x: 6, y: 2 + 1 / 32 }, { x: 6, y: 10 });
    expect(r.ok).toBe(true);
    const s = ed.store.document.sections[0];
    expect(s.seams.map((m) => [m.a, m.b])).toEqual([[{ x: 6, y: 2 }, { x: 6, y: 10 }]]);
    expect(ed.analysis.patches(s)).toHaveLength(2);
    const short = addSeamByValues(ed.store.document, id, { x: 3, y: 4 }, { x: 5, y: 4 }, ed.analysis);
    expect(short.ok === false && short.message).toMatch(/splits no patch/);
    ed.undo();
    expect(ed.store.document.sections[0].seams).toEqual([]);
  });
});
