import { buildCuttingList, buildGardenGate, buildOrchardWheel, distanceToSegment, type Point } from '@seamwright/piecing';
import { buildSewingGuide, pressWords } from './sewing-guide';
import type { PieceStep } from './sewing-guide-types';

/** Whether `p` lies on the outline `ring` (within 1e-6 in.). */
function onOutline(p: Point, ring: readonly Point[]): boolean {
  return ring.some((a, i) => distanceToSegment(p, a, ring[(i + 1) % ring.length]) < 1e-6);
}

describe('sewing guide', () => {
  const wheel = buildOrchardWheel();
  const guide = buildSewingGuide(wheel);
  const b = guide.sections.find((s) => s.label === 'B')!;
  const pieces = b.steps.filter((s): s is PieceStep => s.kind === 'piece');

  it('walks a section patch by patch in piecing order, then trims it', () => {
    expect(b.steps.map((s) => (s.kind === 'piece' ? s.patchLabel : 'trim'))).toEqual(['B1', 'B2', 'B3', 'trim']);
    expect(pieces.map((s) => s.position)).toEqual([1, 2, 3]);
  });

  it('counts every copy: ring repeats × blocks', () => {
    // Orchard Wheel: A and B repeat 8 times, C 16, D 4, in one block.
    expect(guide.sections.map((s) => [s.label, s.copies])).toEqual([['A', 8], ['B', 8], ['C', 16], ['D', 4]]);
    // Garden Gate: no ring repeats, made 4 times.
    expect(buildSewingGuide(buildGardenGate()).sections.map((s) => s.copies)).toEqual([4, 4, 4]);
  });

  it('takes each piece from the cutting list: a fabric with its rough cut, or a slice of the named strip set', () => {
    const list = buildCuttingList(wheel);
    const row = (label: string) => list.patches.find((p) => p.patchLabel === label)!;
    expect(pieces[0].piece).toMatchObject({ kind: 'strip-set', name: 'Centre stripe', colour: null });
    expect(pieces[0].piece.sizeText).toBe(`a slice of Centre stripe, ${size(row('B1').cutWidthIn, row('B1').cutLengthIn)}`);
    expect(pieces[0].piece.strips.length).toBeGreaterThanOrEqual(2);
    expect(pieces[1].piece).toMatchObject({ kind: 'fabric', name: 'Sage', colour: wheel.fabrics.find((f) => f.id === 'sage')!.colour });
    expect(pieces[1].piece.sizeText).toBe(size(row('B2').cutWidthIn, row('B2').cutLengthIn));
  });

  it('names the line to sew on the shared edge, the press and the pre-trim', () => {
    expect([pieces[0].sewLine, pieces[0].press]).toEqual([null, null]);
    const patch2 = b.patches.find((p) => p.number === 2)!;
    const patch1 = b.patches.find((p) => p.number === 1)!;
    const line = pieces[1].sewLine!;
    // The line lies on both patches' outlines: it is the seam between them.
    expect([line.from, line.to].every((p) => onOutline(p, patch2.polygon) && onOutline(p, patch1.polygon))).toBe(true);
    expect(pieces[1].press).toBe('Press B2 over, the seam toward B2 (the patch just added).');
    expect(pieces[0].preTrim).toBe('Fold the paper back on the line between B1 and B2 and trim the fabric ¼ in. beyond it.');
    expect(pieces[2].preTrim).toBeNull();
    expect(b.steps[3]).toMatchObject({ kind: 'trim' });
    expect((b.steps[3] as { text: string }).text).toContain('¼ in. beyond the sewing line');
  });

  it('words the three ways a patch seam is pressed', () => {
    expect(pressWords('open', 'C2')).toBe('Press the seam open.');
    expect(pressWords('previous', 'C2', 'C1')).toBe('Press the seam toward C1, away from C2.');
  });

  it('presses each patch as the designer set its seam', () => {
    const gate = buildGardenGate();
    const b = gate.sections.find((s) => s.label === 'B')!;
    b.seams = b.seams.map((seam, i) => ({ ...seam, press: i === 0 ? 'previous' : 'open' }));
    const steps = buildSewingGuide(gate).sections.find((s) => s.label === 'B')!.steps as PieceStep[];
    expect(steps.slice(0, 3).map((s) => s.press)).toEqual([null, 'Press the seam toward B1, away from B2.', 'Press the seam open.']);
  });

  it('takes the joins from the joining plan: rings first, then outward, with pressing and matching marks', () => {
    expect(guide.joins.map((j) => j.label)).toEqual([
      'Join the 8 copies of A into a ring',
      'Join the 8 copies of B into a ring',
      'Join the 16 copies of C into a ring',
      'Join the 4 copies of D into a ring',
      'Join the A ring to the B ring',
      'Join unit 5 (A, B) to the C ring',
      'Join unit 6 (A, B, C) to the D ring',
    ]);
    const ringA = guide.joins[0];
    expect([ringA.kind, ringA.sectionIds, ringA.marks.length]).toEqual(['ring', ['star'], 0]);
    expect(ringA.seamText).toMatch(/^Sew the 8 copies side by side, each to the next; the last seam closes the ring/);
    const curved = guide.joins[4];
    expect(curved.sectionIds).toEqual(['star', 'stripe-band']);
    expect(curved.seamText).toMatch(/^A curved seam, .+ of seam: pin at the matching marks/);
    expect(curved.marks.length).toBeGreaterThan(0);
    expect(curved.press).toBe('Press the seam toward the A ring');
    expect(guide.joinsAreDefault).toBe(true);
    expect(guide.problems).toEqual([]);
  });
});

/** "2 ¾ × 4 ⅛ in." as the guide writes a rough cut. */
function size(w: number, l: number): string {
  const eighths = (n: number) => {
    const whole = Math.floor(n + 1e-9);
    const e = Math.round((n - whole) * 8);
    const glyph = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'][e];
    return whole > 0 && glyph ? `${whole} ${glyph}` : glyph || String(whole);
  };
  return `${eighths(w)} × ${eighths(l)} in.`;
}
