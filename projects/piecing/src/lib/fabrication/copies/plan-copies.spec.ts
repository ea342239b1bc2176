import { describe, expect, it } from 'vitest';
import { buildOrchardWheel } from '../../demo/index';
import type { Section } from '../../document/pattern-schema';
import { foundationCopies, pieceTemplateCopies, planCopies } from './plan-copies';

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
    // Sections without seams: one patch, one pressing each, so a template lasts 16 sections.
    expect(plan.sections.map(({ sectionId, label, perBlock, templatesNeeded, patches, sectionsPerTemplate, printedCopies }) => ({ sectionId, label, perBlock, templatesNeeded, patches, sectionsPerTemplate, printedCopies }))).toEqual([
      { sectionId: 'a', label: 'A', perBlock: 8, templatesNeeded: 8, patches: 1, sectionsPerTemplate: 16, printedCopies: 1 },
      { sectionId: 'b', label: 'B', perBlock: 1, templatesNeeded: 1, patches: 1, sectionsPerTemplate: 16, printedCopies: 1 },
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

  it('a foundation template lasts whole sections of k pressings each: the docs/design-notes.md#copies check values', () => {
    // Check values (common practice, docs/design-notes.md#copies): with P = 16 a 4-patch section gets
    // floor(16 / 4) = 4 uses from one template, a 5-patch section floor(16 / 5) = 3.
    expect(foundationCopies(4, 4, 16)).toEqual({ sectionsPerTemplate: 4, copies: 1 });
    expect(foundationCopies(5, 4, 16)).toEqual({ sectionsPerTemplate: 4, copies: 2 });
    expect(foundationCopies(3, 5, 16)).toEqual({ sectionsPerTemplate: 3, copies: 1 });
    expect(foundationCopies(4, 5, 16)).toEqual({ sectionsPerTemplate: 3, copies: 2 });
    // A section of more patches than pressings still needs a whole template per section: u = max(1, …).
    expect(foundationCopies(8, 20, 16)).toEqual({ sectionsPerTemplate: 1, copies: 8 });
  });

  it('a piece template is pressed once per piece: 16 pieces with P = 16 take one template, just', () => {
    // Check value (common practice, docs/design-notes.md#copies).
    expect(pieceTemplateCopies(16, 16)).toBe(1);
    expect(pieceTemplateCopies(17, 16)).toBe(2);
    expect(pieceTemplateCopies(1, 16)).toBe(1);
  });

  it('Orchard Wheel: 3-patch sections last 5 uses, the 2-patch corners 8; the stripe patch gets a piece template', () => {
    const plan = planCopies(buildOrchardWheel());
    expect(plan.sections.map((s) => [s.label, s.patches, s.templatesNeeded, s.sectionsPerTemplate, s.printedCopies])).toEqual([
      ['A', 3, 8, 5, 2],
      ['B', 3, 8, 5, 2],
      ['C', 3, 16, 5, 4],
      ['D', 2, 4, 8, 1],
    ]);
    expect(plan.totalPrintedCopies).toBe(9);
    expect(plan.sections[2].figures).toBe('C: 3 patches = 3 pressings per section; 16 pressings last 5 sections; 16 to sew → 4 copies');
    expect(plan.pieceTemplates).toEqual([
      { sectionId: 'stripe-band', patchLabel: 'B1', patchNumber: 1, reason: 'strip-set', pieces: 8, copies: 1, figures: 'B1: 8 pieces, one pressing each; 16 pressings per template → 1 copy' },
    ]);
    expect(plan.rule).toContain('a section of k patches costs k pressings');
    expect(plan.rule).toContain('max(1, floor(16 / k))');
  });

  it('gives a piece template to a patch the designer marks, and counts its pieces over blocks', () => {
    const doc = buildOrchardWheel();
    doc.blockCount = 3;
    doc.sections[3].patches[1].pieceTemplate = true;
    const plan = planCopies(doc);
    // D2: 4 corners × 3 blocks = 12 pieces, one template; B1: 8 × 3 = 24 pieces → ceil(24 / 16) = 2.
    expect(plan.pieceTemplates.map((t) => [t.patchLabel, t.reason, t.pieces, t.copies])).toEqual([
      ['B1', 'strip-set', 24, 2],
      ['D2', 'designer', 12, 1],
    ]);
    expect(plan.totalPieceTemplateCopies).toBe(3);
  });

  it('rejects a pressing count that is not a whole number of at least 1', () => {
    expect(() => planCopies({ sections: [], blockCount: 1, pressingsPerTemplate: 16 }, 0)).toThrow(RangeError);
  });
});
