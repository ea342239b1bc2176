import { describe, expect, it } from 'vitest';
import { SectionAnalysis } from '../analysis/section-analysis';
import { emptyPattern, polar } from '../testing/board-fixtures';
import { applySewableOrder } from './order-commands';
import { addSection, addSeam, findSection, setPiecingOrder } from './section-commands';

const C = { x: 12, y: 12 };
const shared = new SectionAnalysis();

/** A 90° arc section 5–8 in. split by radial seams at 22.5°, 45°, 67.5° into four patches. */
function fourPatchArc() {
  const added = addSection(emptyPattern(), { kind: 'arc', centre: C, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 90 }, shared);
  const sectionId = added.sectionId;
  let document = added.document;
  for (const deg of [22.5, 45, 67.5]) document = addSeam(document, sectionId, polar(C, 5, deg), polar(C, 8, deg), shared);
  return { document, sectionId };
}

function indexAt(document: ReturnType<typeof fourPatchArc>['document'], sectionId: string, deg: number): number {
  const s = findSection(document, sectionId)!;
  return new SectionAnalysis().patchAt(s, polar(C, 6.5, deg))!.index;
}

describe('piecing order and sewability on the board', () => {
  it('finds an order along the arc sewable and a jump across it not, naming the patch and why', () => {
    const { document, sectionId } = fourPatchArc();
    const along = setPiecingOrder(document, sectionId, [10, 30, 55, 80].map((d) => indexAt(document, sectionId, d)), shared);
    const analysis = new SectionAnalysis();
    // Each wedge-shaped piece meets the previous one along one radial seam, with all earlier pieces on
    // one side of it: the rule in docs/design-notes.md#sewability holds at every step.
    expect(analysis.sewability(findSection(along, sectionId)!)).toEqual({ ok: true });
    const jump = setPiecingOrder(document, sectionId, [10, 55, 30, 80].map((d) => indexAt(document, sectionId, d)), shared);
    const verdict = analysis.sewability(findSection(jump, sectionId)!);
    expect(verdict.ok).toBe(false);
    expect(verdict.failingPatchNumber).toBe(2);
    expect(verdict.reason).toMatch(/^A2 shares no seam/);
  });

  it('applies a sewable order in one command when the order is bad', () => {
    const { document, sectionId } = fourPatchArc();
    const jump = setPiecingOrder(document, sectionId, [10, 55, 30, 80].map((d) => indexAt(document, sectionId, d)), shared);
    const { document: fixed, result } = applySewableOrder(jump, sectionId, shared);
    expect(result.ok).toBe(true);
    expect(new SectionAnalysis().sewability(findSection(fixed, sectionId)!)).toEqual({ ok: true });
  });

  it('reports a four-patch (a cross of two seams) as unsewable in any order and suggests a split along a seam', () => {
    // Whatever the order, the last of four patches meeting at a cross touches two earlier patches along
    // two perpendicular stretches, so no single straight seam adds it (docs/design-notes.md#sewability; common practice:
    // a four-patch is pieced as two sections).
    const added = addSection(emptyPattern(), { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] }, shared);
    const sectionId = added.sectionId;
    let document = added.document;
    document = addSeam(document, sectionId, { x: 3, y: 0 }, { x: 3, y: 6 }, shared);
    document = addSeam(document, sectionId, { x: 0, y: 3 }, { x: 6, y: 3 }, shared);
    expect(new SectionAnalysis().patches(findSection(document, sectionId)!)).toHaveLength(4);
    const { document: after, result } = applySewableOrder(document, sectionId, shared);
    expect(after).toBe(document);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.suggestedSplit).toBeDefined();
    const { a, b } = result.suggestedSplit!;
    // The suggested cut runs along one of the two seams, from edge to edge.
    const alongX3 = Math.abs(a.x - 3) < 1e-6 && Math.abs(b.x - 3) < 1e-6 && Math.abs(Math.abs(a.y - b.y) - 6) < 1e-6;
    const alongY3 = Math.abs(a.y - 3) < 1e-6 && Math.abs(b.y - 3) < 1e-6 && Math.abs(Math.abs(a.x - b.x) - 6) < 1e-6;
    expect(alongX3 || alongY3).toBe(true);
  });
});

describe('seam problems on the board', () => {
  it('names a seam that stops short of the patch edge', () => {
    const added = addSection(emptyPattern(), { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] }, shared);
    const s = findSection(added.document, added.sectionId)!;
    const withStub = { ...s, seams: [{ id: 'stub', a: { x: 3, y: 0 }, b: { x: 3, y: 4 } }] };
    const problems = new SectionAnalysis().problems(withStub);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/seam "stub" ends inside a patch at .*2\.000 in\. short/);
  });
});
