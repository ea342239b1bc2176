import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { locatePoint, polygonArea, type Point, type Section } from '@seamwright/piecing';
import { addSection, findSection, moveSectionHandle, setPatchFabric, setPiecingOrder } from '../commands/section-commands';
import { emptyPattern } from '../testing/board-fixtures';
import { SectionAnalysis } from './section-analysis';

const square = (size: number): Section['geometry'] => ({ kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: size, y: 0 }, { x: size, y: size }, { x: 0, y: size }] });

describe('section analysis', () => {
  it('lets a command reuse the patches the board derived for the same section object', () => {
    const analysis = new SectionAnalysis();
    const added = addSection(emptyPattern(), { kind: 'wedge', centre: { x: 12, y: 12 }, radiusIn: 4, startAngleDeg: 0, sweepDeg: 45 }, analysis);
    const section = findSection(added.document, added.sectionId)!;
    const before = analysis.splitsMade;
    // A wedge without seams is one patch.
    expect(analysis.patches(section)).toHaveLength(1);
    const filled = setPatchFabric(added.document, added.sectionId, 0, 'plum', analysis);
    const after = findSection(filled, added.sectionId)!;
    expect(after.patches[0].fabricId).toBe('plum');
    expect(analysis.patches(after)[0].fabricId).toBe('plum');
    expect(analysis.sewability(section)).toEqual({ ok: true });
    // Filling changes assignments only: the outline was split once, when the section was added.
    expect(analysis.splitsMade).toBe(before);
  });

  it('splits a dragged section once per move, however many times the frame asks for its patches', () => {
    const analysis = new SectionAnalysis();
    const added = addSection(emptyPattern(), square(6), analysis);
    let doc = added.document;
    const start = analysis.splitsMade;
    for (let step = 1; step <= 5; step++) {
      doc = moveSectionHandle(doc, added.sectionId, { kind: 'vertex', index: 2 }, { x: 6 + step / 8, y: 6 + step / 8 }, analysis);
      const s = findSection(doc, added.sectionId)!;
      // What the board, the panel and the order list read in one frame.
      analysis.patches(s);
      analysis.sewability(s);
      analysis.problems(s);
    }
    expect(analysis.splitsMade - start).toBe(5);
  });

  it('gives commands the error again for a section it cannot derive, and the board no patches', () => {
    const analysis = new SectionAnalysis();
    const section = { id: 's1', label: 'A', geometry: {
        kind: 'straight',
        get vertices(): never {
          throw new Error('outline crosses itself');
        },
      },
      seams: [],
      patches: [],
    } as unknown as Section;
    expect(() => analysis.derive(section)).toThrow('outline crosses itself');
    expect(() => analysis.derive(section)).toThrow('outline crosses itself');
    expect(analysis.patches(section)).toEqual([]);
    expect(analysis.splitsMade).toBe(1);
  });
});

describe('clicking a patch', () => {
  it('finds each patch of a square split by two seams fanning from one corner (fixed case)', () => {
    // (0,0)–(8,2) and (0,0)–(8,4) across an 8 in. square: patches once shared an index here, and
    // filling A2 filled A1.
    const analysis = new SectionAnalysis();
    const fan: Section = {
      id: 'fan',
      label: 'A',
      geometry: square(8),
      seams: [
        { id: 'm1', a: { x: 0, y: 0 }, b: { x: 8, y: 2 } },
        { id: 'm2', a: { x: 0, y: 0 }, b: { x: 8, y: 4 } },
      ],
      patches: [],
    };
    const patches = analysis.patches(fan);
    expect(patches.map((p) => p.index)).toEqual([0, 1, 2]);
    // Shoelace areas of the known pieces: two triangles ½·8·2 and the rest, 64 − 16.
    expect(patches.map((p) => polygonArea(p.polygon)).sort((a, b) => a - b)).toEqual([8, 8, 48]);
    for (const p of patches) expect(analysis.patchAt(fan, p.labelPoint)?.index).toBe(p.index);
    // Points chosen by hand inside each piece: near (7, 1.5) lies between the two seams.
    const between = analysis.patchAt(fan, { x: 7, y: 2.6 })!;
    const above = analysis.patchAt(fan, { x: 7, y: 0.5 })!;
    const below = analysis.patchAt(fan, { x: 2, y: 6 })!;
    expect(new Set([between.index, above.index, below.index]).size).toBe(3);
    // Renumber so numbers and split order disagree, then fill each in turn where it is clicked: each
    // fill lands on the patch clicked and nowhere else.
    let doc = setPiecingOrder({ ...emptyPattern(), sections: [fan] }, 'fan', [2, 0, 1], analysis);
    expect(analysis.patches(findSection(doc, 'fan')!).map((p) => p.number)).toEqual([2, 3, 1]);
    const fabrics = ['plum', 'oat', 'sage'];
    [{ x: 7, y: 0.5 }, { x: 7, y: 2.6 }, { x: 2, y: 6 }].forEach((at, k) => {
      const s = findSection(doc, 'fan')!;
      doc = setPatchFabric(doc, 'fan', analysis.patchAt(s, at)!.index, fabrics[k], analysis);
    });
    const filled = analysis.patches(findSection(doc, 'fan')!);
    expect(filled[above.index].fabricId).toBe('plum');
    expect(filled[between.index].fabricId).toBe('oat');
    expect(filled[below.index].fabricId).toBe('sage');
  });

  it('property: a click at any patch’s label point or inside points acts on that patch', () => {
    const coord = fc.double({ min: -2, max: 12, noNaN: true });
    const seam = fc.tuple(coord, coord, coord, coord);
    const kind = fc.constantFrom('square', 'wedge', 'arc');
    fc.assert(
      fc.property(kind, fc.array(seam, { minLength: 1, maxLength: 6 }), fc.array(fc.tuple(fc.double({ min: 0.05, max: 0.95, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true })), { minLength: 3, maxLength: 3 }), (k, seams, fractions) => {
        const geometry: Section['geometry'] =
          k === 'square'
            ? square(10)
            : k === 'wedge'
              ? { kind: 'wedge', centre: { x: 5, y: 5 }, radiusIn: 5, startAngleDeg: 20, sweepDeg: 200 }
              : { kind: 'arc', centre: { x: 5, y: 5 }, innerRadiusIn: 2, outerRadiusIn: 5, startAngleDeg: -30, sweepDeg: 240 };
        const section: Section = {
          id: 's',
          label: 'A',
          geometry,
          seams: seams.map(([ax, ay, bx, by], i) => ({ id: `m${i}`, a: { x: ax, y: ay }, b: { x: bx, y: by } })).filter((m) => Math.hypot(m.b.x - m.a.x, m.b.y - m.a.y) > 0.01),
          patches: [],
        };
        const analysis = new SectionAnalysis();
        const patches = analysis.patches(section);
        expect(new Set(patches.map((p) => p.index)).size).toBe(patches.length);
        for (const p of patches) {
          expect(analysis.patchAt(section, p.labelPoint)?.index).toBe(p.index);
          // Inside points: between the label point and a vertex, kept where strictly inside this patch
          // (a point on a shared seam belongs to either side).
          for (const [f, g] of fractions) {
            const v = p.polygon[Math.floor(g * p.polygon.length) % p.polygon.length];
            const q: Point = { x: p.labelPoint.x + (v.x - p.labelPoint.x) * f, y: p.labelPoint.y + (v.y - p.labelPoint.y) * f };
            if (locatePoint(q, p.polygon, 1e-6) !== 'inside') continue;
            if (patches.some((o) => o !== p && locatePoint(q, o.polygon, 1e-6) !== 'outside')) continue;
            expect(analysis.patchAt(section, q)?.index).toBe(p.index);
          }
        }
      }),
      { numRuns: 300 },
    );
  });
});
