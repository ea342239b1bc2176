import { describe, expect, it } from 'vitest';
import { buildGardenGate, buildOrchardWheel } from '../demo/index';
import type { PatternDocument, Point } from '../document/pattern-schema';
import { matchingMarks } from '../fabrication/matching-marks/index';
import { expandRingRepeat } from '../geometry/index';
import { withRingEdgesAsCurves } from './follow-ring-edges';
import { checkJoiningPlan, defaultJoiningPlan, resolveJoiningPlan } from './index';
import { documentOf, notchedU, squareGrid, straightSection, threeRhombi } from './joining-test-patterns';

const dist = (a: Point, b: Point) => Math.hypot(a.x - b.x, a.y - b.y);

describe('defaultJoiningPlan and resolveJoiningPlan: Orchard Wheel', () => {
  const doc = buildOrchardWheel();
  const resolved = resolveJoiningPlan(doc);

  it('joins the copies of every ring repeat into a ring first, with one join per copy (the last closing the ring)', () => {
    const plan = defaultJoiningPlan(doc);
    expect(plan.steps.slice(0, 4)).toEqual([
      { id: 'ring-star', kind: 'ring', sectionId: 'star', press: 'clockwise' },
      { id: 'ring-stripe-band', kind: 'ring', sectionId: 'stripe-band', press: 'clockwise' },
      { id: 'ring-points', kind: 'ring', sectionId: 'points', press: 'clockwise' },
      { id: 'ring-corner', kind: 'ring', sectionId: 'corner', press: 'clockwise' },
    ]);
    const rings = resolved.steps.filter((s) => s.kind === 'ring');
    expect(rings.map((s) => [s.label, s.ringCount, s.seam.paths.length])).toEqual([
      ['Join the 8 copies of A into a ring', 8, 8],
      ['Join the 8 copies of B into a ring', 8, 8],
      ['Join the 16 copies of C into a ring', 16, 16],
      ['Join the 4 copies of D into a ring', 4, 4],
    ]);
    // The seams between neighbouring copies are radial: 5 in. in the star (its radius), 3 in. across
    // each band (8 − 5, 11 − 8), and 2 in. between corners (13 − 11, half the 26 in. block less the radius).
    expect(rings.map((s) => s.seam.lengthIn)).toEqual([40, 24, 48, 8].map((v) => expect.closeTo(v, 6)));
    expect(rings.every((s) => s.seam.kind === 'straight')).toBe(true);
  });

  it('then joins the rings from the centre outward, each onto the unit grown so far, into one final unit', () => {
    const joins = resolved.steps.filter((s) => s.kind === 'join');
    expect(joins.map((s) => s.label)).toEqual(['Join the A ring to the B ring', 'Join unit 5 (A, B) to the C ring', 'Join unit 6 (A, B, C) to the D ring']);
    expect(joins.map((s) => s.partA.id)).toEqual(['ring-star', 'join-1', 'join-2']);
    expect(joins.at(-1)!.result.sectionIds).toEqual(['star', 'stripe-band', 'points', 'corner']);
    expect(resolved.problems).toEqual([]);
    expect(resolved.isDefault).toBe(true);
  });

  it('sews each ring onto the unit inside it along one closed circle', () => {
    const joins = resolved.steps.filter((s) => s.kind === 'join');
    joins.forEach((step, k) => {
      const radius = [5, 8, 11][k];
      expect(step.seam.kind).toBe('curved');
      expect(step.seam.paths).toHaveLength(1);
      const path = step.seam.paths[0];
      expect(path[0]).toBe(path.at(-1));
      for (const p of path) expect(Math.abs(dist(p, { x: 13, y: 13 }) - radius)).toBeLessThan(0.0021);
      // Circumference 2πr (standard mathematical tables, CRC); the chords are shorter than the arc by
      // less than the flattening allows.
      expect(step.seam.lengthIn).toBeLessThan(2 * Math.PI * radius);
      expect(step.seam.lengthIn).toBeGreaterThan(2 * Math.PI * radius * 0.9995);
    });
  });

  it('gives each curved join matching marks that coincide on both parts to 0.001 in., the corners against the points ring included', () => {
    const marks = matchingMarks(withRingEdgesAsCurves(doc));
    const markPoints = (sectionIds: string[]) =>
      marks.filter((s) => sectionIds.includes(s.sectionId)).flatMap((s) => s.instances.flatMap((i) => i.marks.filter((m) => m.kind === 'spacing').map((m) => m.point)));
    for (const step of resolved.steps.filter((s) => s.seam.kind === 'curved')) {
      expect(step.marks.length).toBeGreaterThan(0);
      const sideA = markPoints(step.partA.sectionIds);
      const sideB = markPoints(step.partB.sectionIds);
      for (const m of step.marks) {
        expect(Math.min(...sideA.map((p) => dist(p, m)))).toBeLessThanOrEqual(0.001);
        expect(Math.min(...sideB.map((p) => dist(p, m)))).toBeLessThanOrEqual(0.001);
        // and on the seam itself
        const path = step.seam.paths[0];
        expect(Math.min(...path.map((p) => dist(p, m)))).toBeLessThan(0.5);
      }
    }
    const cornerJoin = resolved.steps.find((s) => s.partB.id === 'ring-corner')!;
    // r = 11: 2π·11 ≈ 69.1 in. / 2 in. ≈ 35 steps, the nearest multiple of the 16-fold points ring is 32.
    expect(cornerJoin.marks).toHaveLength(32);
  });

  it('marks the corners only because their polyline edge is read as the curve it follows', () => {
    const raw = matchingMarks(doc).find((s) => s.sectionId === 'corner')!;
    expect(raw.instances.every((i) => i.marks.length === 0)).toBe(true);
    const followed = matchingMarks(withRingEdgesAsCurves(doc)).find((s) => s.sectionId === 'corner')!;
    expect(followed.instances.every((i) => i.marks.filter((m) => m.kind === 'spacing').length === 8)).toBe(true);
  });
});

describe('defaultJoiningPlan: Garden Gate', () => {
  const doc = buildGardenGate();

  it('is a straight plan from the middle section out: the gate, then the roof, then the path', () => {
    expect(defaultJoiningPlan(doc).steps).toEqual([
      { id: 'join-1', kind: 'join', a: 'gate', b: 'roof', press: 'a' },
      { id: 'join-2', kind: 'join', a: 'join-1', b: 'path', press: 'a' },
    ]);
    const resolved = resolveJoiningPlan(doc);
    expect(resolved.problems).toEqual([]);
    expect(resolved.steps.map((s) => s.label)).toEqual(['Join B to A', 'Join unit 1 (A, B) to C']);
    for (const [step, y] of resolved.steps.map((s, i) => [s, [3, 5.5][i]] as const)) {
      expect(step.seam.kind).toBe('straight');
      expect(step.seam.paths).toHaveLength(1);
      expect(step.seam.lengthIn).toBeCloseTo(8, 9);
      expect(step.seam.paths[0].every((p) => Math.abs(p.y - y) < 1e-9)).toBe(true);
      expect(step.marks).toEqual([]);
    }
    expect(resolved.steps[1].result.sectionIds).toEqual(['roof', 'gate', 'path']);
    expect(resolved.steps[0].press).toEqual({ toward: 'gate' });
    expect(resolved.steps[0].pressLabel).toBe('Press the seam toward B');
  });

  it("uses the designer's plan when there is one, with its pressing", () => {
    const withPlan: PatternDocument = {
      ...doc,
      joiningPlan: {
        steps: [
          { id: 'top', kind: 'join', a: 'roof', b: 'gate', press: 'b' },
          { id: 'all', kind: 'join', a: 'top', b: 'path', press: 'open' },
        ],
      },
    };
    const resolved = resolveJoiningPlan(withPlan);
    expect(resolved.isDefault).toBe(false);
    expect(resolved.problems).toEqual([]);
    expect(resolved.steps.map((s) => [s.label, s.press, s.pressLabel])).toEqual([
      ['Join A to B', { toward: 'gate' }, 'Press the seam toward B'],
      ['Join unit 1 (A, B) to C', { open: true }, 'Press the seam open'],
    ]);
  });
});

describe('defaultJoiningPlan: blocks of squares', () => {
  it.each([3, 4, 5])('joins a square grid of square sections, %i to a side, without an inset, into one unit', (n) => {
    const doc = squareGrid(n);
    const resolved = resolveJoiningPlan(doc);
    expect(resolved.problems).toEqual([]);
    // n² sections take n² − 1 joins, every one a single straight seam.
    expect(resolved.steps).toHaveLength(n * n - 1);
    expect(resolved.steps.every((s) => s.seam.kind === 'straight' && s.seam.paths.length === 1)).toBe(true);
    expect(resolved.steps.at(-1)!.result.sectionIds).toHaveLength(n * n);
  });
});

describe('checkJoiningPlan', () => {
  it('reports an inset where the third rhombus must be sewn into the corner of the other two', () => {
    const doc = threeRhombi();
    const problems = checkJoiningPlan(doc, {
      steps: [
        { id: 'xy', kind: 'join', a: 'x', b: 'y', press: 'a' },
        { id: 'all', kind: 'join', a: 'xy', b: 'z', press: 'a' },
      ],
    });
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ stepId: 'all', kind: 'inset' });
    expect(problems[0].message).toBe('Step 2: unit 1 (X, Y) and Z meet along an edge that turns a corner, so joining them needs an inset (Y) seam, pivoting at (4, 4).');
    expect(dist(problems[0].point!, { x: 4, y: 4 })).toBeLessThan(0.01);
  });

  it('reports an inset where a part meets a unit along two separate stretches of edge', () => {
    const doc = notchedU();
    const problems = checkJoiningPlan(doc, {
      steps: [
        { id: 'lw', kind: 'join', a: 'l', b: 'w', press: 'a' },
        { id: 'u', kind: 'join', a: 'lw', b: 'rt', press: 'a' },
        { id: 'uz', kind: 'join', a: 'u', b: 'z', press: 'a' },
        { id: 'all', kind: 'join', a: 'uz', b: 'v', press: 'a' },
      ],
    });
    const inset = problems.find((p) => p.stepId === 'uz')!;
    expect(inset.kind).toBe('inset');
    expect(inset.message).toContain('unit 2 (L, W, R) and Z meet along 2 separate stretches of edge');
    // The pivot is an end of one stretch (x = 1 or x = 2, y = 0 or 2).
    expect([1, 2]).toContain(Math.round(inset.point!.x * 1000) / 1000);
    expect([0, 2]).toContain(Math.round(inset.point!.y * 1000) / 1000);
    // V, sewn last into the pocket left between Z and the U, turns two corners: another inset.
    expect(problems.map((p) => [p.stepId, p.kind])).toEqual([
      ['uz', 'inset'],
      ['all', 'inset'],
    ]);
  });

  it('accepts a plan that joins the same U without insets', () => {
    const doc = notchedU();
    const plan = {
      steps: [
        { id: 'zv', kind: 'join' as const, a: 'z', b: 'v', press: 'a' as const },
        { id: 'lzv', kind: 'join' as const, a: 'l', b: 'zv', press: 'a' as const },
        { id: 'top', kind: 'join' as const, a: 'lzv', b: 'rt', press: 'a' as const },
        { id: 'all', kind: 'join' as const, a: 'top', b: 'w', press: 'a' as const },
      ],
    };
    expect(checkJoiningPlan(doc, plan)).toEqual([]);
    // and the default plan finds a plan without insets too
    expect(resolveJoiningPlan(doc).problems).toEqual([]);
  });

  it('names missing sections, unknown and reused parts and parts that do not touch', () => {
    const doc = buildGardenGate();
    const problems = checkJoiningPlan(doc, {
      steps: [
        { id: 'j1', kind: 'join', a: 'roof', b: 'chimney', press: 'a' },
        { id: 'j2', kind: 'join', a: 'roof', b: 'path', press: 'a' },
        { id: 'j3', kind: 'join', a: 'j2', b: 'j2', press: 'a' },
        { id: 'j4', kind: 'ring', sectionId: 'gate', press: 'open' },
      ],
    });
    expect(problems.map((p) => [p.stepId, p.kind, p.message])).toEqual([
      ['j1', 'unknown-part', 'Step 1: "chimney" is neither a section nor an earlier step.'],
      ['j2', 'reused-part', 'Step 2: A was already joined in step 1.'],
      // Step 2 could not use A, so its unit holds C alone.
      ['j3', 'reused-part', 'Step 3: it joins unit 2 (C) to itself.'],
      ['j4', 'unknown-part', 'Step 4: B has no ring repeat, so it has no copies to join into a ring.'],
      [null, 'missing-section', 'A is never joined to the rest of the block (B).'],
      [null, 'missing-section', 'C is never joined to the rest of the block (B).'],
    ]);
  });

  it('reports two parts that do not touch, with the gap between them', () => {
    const doc = buildGardenGate();
    const problems = checkJoiningPlan(doc, {
      steps: [
        { id: 'j1', kind: 'join', a: 'roof', b: 'path', press: 'a' },
        { id: 'j2', kind: 'join', a: 'j1', b: 'gate', press: 'a' },
      ],
    });
    expect(problems[0]).toMatchObject({ stepId: 'j1', kind: 'not-touching', point: { x: 8, y: 4.25 } });
    expect(problems[0].message).toBe('Step 1: A and C do not touch (nearest 2.50 in. apart near (8, 4.25)), so there is no seam to join them along.');
    // B then meets the A–C "unit" along its top and its bottom: two stretches, an inset.
    expect(problems.slice(1).map((p) => [p.stepId, p.kind])).toEqual([['j2', 'inset']]);
  });

  it('asks for the ring step of a ring repeat and reports copies never joined', () => {
    const doc = buildOrchardWheel();
    const problems = checkJoiningPlan(doc, { steps: [{ id: 'j1', kind: 'join', a: 'star', b: 'stripe-band', press: 'open' }] });
    expect(problems[0]).toMatchObject({ stepId: 'j1', kind: 'unknown-part', message: 'Step 1: A is a ring repeat: join its copies into a ring first, then join the ring.' });
    expect(problems.filter((p) => p.kind === 'missing-section').map((p) => p.message)).toEqual([
      'The 8 copies of A are never joined into a ring, so A is not in the block.',
      'The 8 copies of B are never joined into a ring, so B is not in the block.',
      'The 16 copies of C are never joined into a ring, so C is not in the block.',
      'The 4 copies of D are never joined into a ring, so D is not in the block.',
    ]);
  });

  it('reports a curved seam without matching marks', () => {
    // Two wedges of one circle (the same centre and radius) joined along their straight radius are fine;
    // an arc section sewn onto a wedge of another radius does not touch; a straight section whose
    // polyline edge follows a circle nobody else has gets no marks.
    const bowl = straightSection('bowl', 'A', [
      { x: 0, y: 4 },
      ...Array.from({ length: 9 }, (_, k) => ({ x: 4 - 4 * Math.cos((k * Math.PI) / 8), y: 4 + 4 * Math.sin((k * Math.PI) / 8) })),
    ]);
    const lid = straightSection('lid', 'B', [
      ...Array.from({ length: 9 }, (_, k) => ({ x: 4 - 4 * Math.cos((k * Math.PI) / 8), y: 4 + 4 * Math.sin((k * Math.PI) / 8) })),
      { x: 8, y: 8 },
      { x: 0, y: 8 },
    ]);
    const problems = checkJoiningPlan(documentOf([bowl, lid]), { steps: [{ id: 'j', kind: 'join', a: 'bowl', b: 'lid', press: 'a' }] });
    expect(problems).toEqual([{ stepId: 'j', kind: 'marks-mismatch', message: 'Step 1: the curved seam between A and B has no matching marks.', point: expect.any(Object) }]);
  });

  it('sees every ring-repeat copy: the copies of the star ring share their radii', () => {
    const doc = buildOrchardWheel();
    const copies = expandRingRepeat(doc.sections[0]);
    expect(copies.map((c) => c.id)).toEqual(['star', 'star_r2', 'star_r3', 'star_r4', 'star_r5', 'star_r6', 'star_r7', 'star_r8']);
    expect(checkJoiningPlan({ ...doc, sections: [doc.sections[0]] }, { steps: [{ id: 'r', kind: 'ring', sectionId: 'star', press: 'anticlockwise' }] })).toEqual([]);
  });
});
