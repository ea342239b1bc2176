import { describe, expect, it } from 'vitest';
import { SectionAnalysis } from '../analysis/section-analysis';
import { emptyPattern } from '../testing/board-fixtures';
import { addSeam, addSection, findSection } from './section-commands';
import { setSeamEnd } from './seam-commands';

describe('typed seam ends', () => {
  it('puts a typed end exactly on the edge it is meant for, and the patch splits', () => {
    const analysis = new SectionAnalysis();
    const square = { kind: 'straight' as const, vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] };
    const added = addSection(emptyPattern(), square, analysis);
    // A seam from the top edge that stops short of the bottom edge: no split yet.
    let doc = addSeam(added.document, added.sectionId, { x: 2, y: 0 }, { x: 2, y: 5.9 }, analysis);
    expect(analysis.patches(findSection(doc, added.sectionId)!)).toHaveLength(1);
    // Typed as 2, 5 31/32 (1/32 in. short): it goes exactly onto y = 6.
    const seamId = findSection(doc, added.sectionId)!.seams[0].id;
    doc = setSeamEnd(doc, added.sectionId, seamId, 'b', { x: 2, y: 6 - 1 / 32 }, analysis);
    const s = findSection(doc, added.sectionId)!;
    expect(s.seams[0].b).toEqual({ x: 2, y: 6 });
    expect(analysis.patches(s).map((p) => p.polygon.length)).toEqual([4, 4]);
  });

  it('snaps onto the edge a previous seam made, not just the outline', () => {
    const analysis = new SectionAnalysis();
    const square = { kind: 'straight' as const, vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] };
    const added = addSection(emptyPattern(), square, analysis);
    let doc = addSeam(added.document, added.sectionId, { x: 0, y: 0 }, { x: 6, y: 6 }, analysis);
    doc = addSeam(doc, added.sectionId, { x: 6, y: 0 }, { x: 4, y: 4 }, analysis);
    const seamId = findSection(doc, added.sectionId)!.seams[1].id;
    // Near the diagonal y = x at (3.02, 2.98): its nearest point is (3, 3), by projection onto the line.
    doc = setSeamEnd(doc, added.sectionId, seamId, 'b', { x: 3.02, y: 2.98 }, analysis);
    const b = findSection(doc, added.sectionId)!.seams[1].b;
    expect(b.x).toBeCloseTo(3, 12);
    expect(b.y).toBeCloseTo(3, 12);
    // Far from every edge: kept where it was typed.
    doc = setSeamEnd(doc, added.sectionId, seamId, 'b', { x: 4, y: 2 }, analysis);
    expect(findSection(doc, added.sectionId)!.seams[1].b).toEqual({ x: 4, y: 2 });
  });
});
