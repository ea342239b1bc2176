import { describe, expect, it } from 'vitest';
import type { Section } from '../../document/pattern-schema';
import { planCopies } from './plan-copies';

const section = (id: string, label: string, count?: number): Section => ({
  id,
  label,
  geometry: { kind: 'wedge', centre: { x: 0, y: 0 }, radiusIn: 5, startAngleDeg: 0, sweepDeg: 45 },
  seams: [],
  patches: [],
  ...(count ? { ringRepeat: { count, centre: { x: 0, y: 0 } } } : {}),
});

describe('planCopies', () => {
  it('a ring of 8 identical sections needs the template 8 times; one freezer-paper copy lasts 16 pressings', () => {
    // docs/design-notes.md#copies: templates needed = sections × ring repeats; printed = ceil(uses / pressings).
    // 16 pressings per template is one practitioner's rule of thumb (common practice, docs/design-notes.md#common-practice).
    const plan = planCopies({ sections: [section('a', 'A', 8), section('b', 'B')], blockCount: 1, pressingsPerTemplate: 16 });
    expect(plan.sections).toEqual([
      { sectionId: 'a', label: 'A', perBlock: 8, templatesNeeded: 8, printedCopies: 1 },
      { sectionId: 'b', label: 'B', perBlock: 1, templatesNeeded: 1, printedCopies: 1 },
    ]);
    expect(plan.totalTemplatesNeeded).toBe(9);
  });

  it('multiplies by blocks and divides by the pressings, rounding up', () => {
    const doc = { sections: [section('a', 'A', 16), section('c', 'C', 4)], blockCount: 3, pressingsPerTemplate: 16 };
    // 16 × 3 = 48 uses → 3 copies; 4 × 3 = 12 uses → 1 copy.
    expect(planCopies(doc).sections.map((s) => [s.templatesNeeded, s.printedCopies])).toEqual([[48, 3], [12, 1]]);
    // 12 pressings: 48 / 12 = 4; 12 / 12 = 1. 10 pressings: ceil(4.8) = 5, ceil(1.2) = 2.
    expect(planCopies(doc, 12).sections.map((s) => s.printedCopies)).toEqual([4, 1]);
    expect(planCopies(doc, 10).totalPrintedCopies).toBe(7);
  });

  it('rejects a pressing count that is not a whole number of at least 1', () => {
    expect(() => planCopies({ sections: [], blockCount: 1, pressingsPerTemplate: 16 }, 0)).toThrow(RangeError);
  });
});
