import { describe, expect, it } from 'vitest';
import { buildOrchardWheel } from '../../demo/index';
import { readPatternDocument, type PatternDocumentInput, type Point } from '../../document/index';
import { buildCuttingList } from './build-cutting-list';
import { fitRoughCut } from './rough-cut-fit';

/** A 1 × 6 in. bar turned by 45° about (4, 4), as one patch of one section. */
const turnedBar = (): Point[] => {
  const c = Math.SQRT1_2;
  const corner = (u: number, v: number) => ({ x: 4 + (u * c - v * c), y: 4 + (u * c + v * c) });
  return [corner(-3, -0.5), corner(3, -0.5), corner(3, 0.5), corner(-3, 0.5)];
};

const barDocument = (roughCut?: { widthIn: number; lengthIn: number }): PatternDocumentInput => ({
  formatVersion: 2,
  title: 'Turned bar',
  canvas: { widthIn: 8, heightIn: 8 },
  fabrics: [{ id: 'ink', name: 'Ink', colour: '#262b3d' }],
  sections: [{ id: 'bar', label: 'A', geometry: { kind: 'straight', vertices: turnedBar() }, patches: [{ number: 1, anchor: { x: 4, y: 4 }, fabricId: 'ink', ...(roughCut ? { roughCut } : {}) }] }],
});

describe("the designer's rough cut", () => {
  it('covers a turned bar only when turned with it: the bar with ¼ in. allowance is 1½ × 6½ in.', () => {
    // A w × h rectangle offset by d with mitre joins is (w + 2d) × (h + 2d) (docs/design-notes.md#reference-values):
    // 1 × 6 in. with d = ¼ in. is 1½ × 6½ in., whichever way it is turned. Its upright box is 5.66 in. square.
    const bar = turnedBar();
    const fits = fitRoughCut(bar, { widthIn: 6.625, lengthIn: 1.625 }, 0.25);
    expect(fits.covers).toBe(true);
    expect([45, 135]).toContain(Math.round(fits.angleDeg));
    expect([fits.neededWidthIn, fits.neededLengthIn]).toEqual([1.5, 6.5]);
    expect(fitRoughCut(bar, { widthIn: 1.625, lengthIn: 6.375 }, 0.25).covers).toBe(false);
    expect(fitRoughCut(bar, { widthIn: 1.375, lengthIn: 7 }, 0.25).covers).toBe(false);
    // A 6 in. square covers the 5.66 in. box upright, though far from the bar's own shape.
    expect(fitRoughCut(bar, { widthIn: 6, lengthIn: 6 }, 0.25).covers).toBe(true);
  });

  it('is listed in place of the computed piece, with no problem when it covers', () => {
    const computed = buildCuttingList(readPatternDocument(barDocument()));
    // The computed piece adds the ½ in. piecing margin too: 1 + 2 × ¾ = 2½ by 6 + 2 × ¾ = 7½ in.
    expect([computed.patches[0].cutWidthIn, computed.patches[0].cutLengthIn]).toEqual([2.5, 7.5]);
    expect(computed.patches[0].roughCutSetByDesigner).toBe(false);
    const list = buildCuttingList(readPatternDocument(barDocument({ widthIn: 7, lengthIn: 2 })));
    expect(list.patches[0]).toMatchObject({ cutWidthIn: 2, cutLengthIn: 7, roughCutSetByDesigner: true });
    expect(list.fabrics[0].pieces.map((g) => [g.widthIn, g.lengthIn, g.count])).toEqual([[2, 7, 1]]);
    expect(list.problems).toEqual([]);
  });

  it('is reported in plain words when it cannot cover the patch with its allowance in any turn', () => {
    const list = buildCuttingList(readPatternDocument(barDocument({ widthIn: 1.375, lengthIn: 7 })));
    expect(list.patches[0]).toMatchObject({ cutWidthIn: 1.375, cutLengthIn: 7, roughCutSetByDesigner: true });
    expect(list.problems).toEqual([
      {
        sectionId: 'bar',
        patchLabel: 'A1',
        message: 'the 1 3/8 × 7 in. piece set for A1 does not cover the patch with its 1/4 in. seam allowance, however it is turned: it needs at least 1 1/2 × 6 1/2 in.',
      },
    ]);
  });
});

describe("the designer's strip-set sub-cut and strip-set names", () => {
  it('uses the sub-cut the designer set for the Orchard Wheel stripe and counts the sub-cuts per sewn set from it', () => {
    const doc = buildOrchardWheel();
    const computed = buildCuttingList(doc).stripSets[0];
    expect(computed.subCutSetByDesigner).toBe(false);
    doc.sections[1].patches[0].stripSet!.subCutLengthIn = 6;
    const set = buildCuttingList(doc).stripSets[0];
    expect(set).toMatchObject({ displayName: 'Centre stripe', subCutLengthIn: 6, subCutSetByDesigner: true, subCutCount: 8, subCutsPerSet: 7, setCount: 2 });
    const row = buildCuttingList(doc).patches.find((p) => p.patchLabel === 'B1')!;
    // The sewn set is 2 + 1 + 2 in. finished + 2 × ¼ in. = 5½ in. wide; each slice is cut 6 in. long.
    expect([row.cutWidthIn, row.cutLengthIn]).toEqual([5.5, 6]);
    expect(buildCuttingList(doc).problems).toEqual([]);
  });

  it('warns when the set sub-cut is shorter than the patch with its allowance along the strips', () => {
    const doc = buildOrchardWheel();
    doc.sections[1].patches[0].stripSet!.subCutLengthIn = 3;
    const problems = buildCuttingList(doc).problems;
    expect(problems).toHaveLength(1);
    // The stripe patch runs along the strips from its inner corners, 1 in. off the radius on the 5 in.
    // circle (at √(5² − 1²) = 4.899 in. from the centre), to the top of the 8 in. circle: 3.101 in.,
    // + 2 × ¼ in. allowance = 3.601 in., rounded up to 1/16 in.: 3 5/8 in.
    expect(problems).toEqual([
      { sectionId: 'stripe-band', patchLabel: 'B1', message: 'Centre stripe: the sub-cut of 3 in. set for it is shorter than patch B1 with its seam allowance along the strips (3 5/8 in.)' },
    ]);
  });

  it('names unnamed strip sets by their place in the list, never by their ids', () => {
    const doc = buildOrchardWheel();
    delete doc.sections[1].patches[0].stripSet!.name;
    doc.sections[2].patches[0] = {
      ...doc.sections[2].patches[0],
      fabricId: undefined,
      stripSet: { id: 'internal-9x', strips: [{ fabricId: 'plum', finishedWidthIn: 1 }, { fabricId: 'oat', finishedWidthIn: 0.5 }], axisAngleDeg: -90, offsetIn: 0 },
    };
    const list = buildCuttingList(doc);
    expect(list.stripSets.map((s) => s.displayName)).toEqual(['Strip set 1', 'Strip set 2']);
    const words = JSON.stringify(list.problems) + list.stripSets.map((s) => s.displayName).join(' ');
    expect(words).not.toContain('centre-stripe');
    expect(words).not.toContain('internal-9x');
    // The 1½ in. set cannot span the C point across its strips: said with its list name.
    expect(list.problems.some((p) => p.message.startsWith('Strip set 2 is narrower than patch C1'))).toBe(true);
  });
});
