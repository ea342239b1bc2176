import { describe, expect, it } from 'vitest';
import { addSection } from './section-commands';
import { nudgeSection, nudgeStepIn } from './nudge-commands';
import { SectionAnalysis } from '../analysis/section-analysis';
import { emptyPattern } from '../testing/board-fixtures';

describe('nudgeStepIn', () => {
  it('is the grid snap step, ⅛ in. with the grid off, and 1 in. or 1 cm with Shift', () => {
    expect(nudgeStepIn('eighth-in', 'in', false)).toBe(0.125);
    expect(nudgeStepIn('quarter-in', 'in', false)).toBe(0.25);
    expect(nudgeStepIn('half-in', 'in', false)).toBe(0.5);
    // 1 in. = 2.54 cm exactly (international yard and pound agreement, 1959).
    expect(nudgeStepIn('half-cm', 'cm', false)).toBeCloseTo(0.5 / 2.54, 12);
    expect(nudgeStepIn('off', 'in', false)).toBe(0.125);
    expect(nudgeStepIn('eighth-in', 'in', true)).toBe(1);
    expect(nudgeStepIn('half-cm', 'cm', true)).toBeCloseTo(1 / 2.54, 12);
  });
});

describe('nudgeSection', () => {
  it('moves the outline, seams and patch anchors together by the step, in the arrow’s direction', () => {
    const analysis = new SectionAnalysis();
    const added = addSection(emptyPattern(), { kind: 'straight', vertices: [{ x: 1, y: 1 }, { x: 5, y: 1 }, { x: 5, y: 5 }, { x: 1, y: 5 }] }, analysis);
    const withSeam = { ...added.document, sections: [{ ...added.document.sections[0], seams: [{ id: 'm-1', a: { x: 3, y: 1 }, b: { x: 3, y: 5 } }] }] };
    const right = nudgeSection(withSeam, added.sectionId, 'ArrowRight', 0.125).sections[0];
    expect(right.geometry.kind === 'straight' && right.geometry.vertices[0]).toEqual({ x: 1.125, y: 1 });
    expect(right.seams[0].a).toEqual({ x: 3.125, y: 1 });
    const up = nudgeSection(withSeam, added.sectionId, 'ArrowUp', 1).sections[0];
    expect(up.geometry.kind === 'straight' && up.geometry.vertices[2]).toEqual({ x: 5, y: 4 });
    expect(up.seams[0].b).toEqual({ x: 3, y: 4 });
  });

  it('leaves the document as it is for other keys, unknown sections and empty steps', () => {
    const analysis = new SectionAnalysis();
    const { document, sectionId } = addSection(emptyPattern(), { kind: 'wedge', centre: { x: 6, y: 6 }, radiusIn: 3, startAngleDeg: 0, sweepDeg: 90 }, analysis);
    expect(nudgeSection(document, sectionId, 'Enter', 1)).toBe(document);
    expect(nudgeSection(document, 'nope', 'ArrowLeft', 1)).toBe(document);
    expect(nudgeSection(document, sectionId, 'ArrowLeft', 0)).toBe(document);
  });
});
