import type { Point, Section, Seam, StripSet } from '../document/pattern-schema';
import { CHORD_TOLERANCE_IN, GEOMETRY_EPSILON_IN, MIN_PATCH_AREA_SQ_IN, SEAM_REACH_TOLERANCE_IN } from '../tolerance';
import { patchLabelPoint } from './label-point';
import { locatePoint, polygonArea, polygonBounds } from './polygon';
import { flattenSectionOutline } from './section-outline';
import { lineChords, splitRingAtChord, type Chord } from './split-polygon';
import { formatPoint } from './vector';

/** One patch of a section, derived from its outline and seams. */
export interface DerivedPatch {
  /**
   * The patch's identity: its place in the order the seams split the outline (0-based). It depends only
   * on the outline and the seams, so it stays put while numbers, fabrics and strip sets change.
   */
  index: number;
  /**
   * Where the label goes and where a click finds the patch: the pole of inaccessibility, inside the
   * patch. Found the first time it is read (the cutting list and sewability never need it).
   */
  readonly labelPoint: Point;
  /** Piecing-order number, 1 … */
  number: number;
  /** Section letter + number, as quilters write it: `A1`. */
  label: string;
  /** Outline ring in inches (arcs flattened), closing point not repeated. */
  polygon: Point[];
  fabricId?: string;
  stripSet?: StripSet;
}

/** Something about the seams or patch assignments of a section that the designer should fix. */
export interface SeamProblem {
  kind: 'seam-crosses-nothing' | 'seam-stops-short' | 'anchor-outside' | 'anchor-shared';
  message: string;
  /** The seam concerned (seam problems). */
  seamId?: string;
  /** The patch number concerned (anchor problems). */
  patchNumber?: number;
  /** Where the problem is, in inches. */
  point?: Point;
}

/** Options for {@link derivePatches}; every tolerance defaults to the value in `tolerance.ts`. */
export interface DerivePatchesOptions {
  /** Chord tolerance for flattening arc outlines, in inches. */
  toleranceIn?: number;
  /** How near a seam end must come to a patch edge to count as reaching it, in inches. */
  reachToleranceIn?: number;
  /**
   * The section's split, when the caller already has it (same outline and seams, e.g. cached by the
   * board while only the assignments changed): derivePatches then numbers it without splitting again.
   */
  split?: SplitResult;
}

/** The patch polygons and problems of a section before numbering. */
export interface SplitResult {
  /** Patch outlines in split order (array position = the patch's `index`). */
  polygons: Point[][];
  problems: SeamProblem[];
}

/**
 * Splits the section outline by its seams, in document order. A seam splits every patch it fully
 * crosses (edge to edge, its ends within the reach tolerance of the edges or beyond them) into two; a
 * patch it enters but does not cross is left whole and reported with the seam id and where it stops.
 */
export function splitSection(section: Pick<Section, 'geometry' | 'seams'>, options: DerivePatchesOptions = {}): SplitResult {
  const reachIn = options.reachToleranceIn ?? SEAM_REACH_TOLERANCE_IN;
  let polygons: Point[][] = [flattenSectionOutline(section.geometry, options.toleranceIn ?? CHORD_TOLERANCE_IN)];
  const problems: SeamProblem[] = [];
  for (const seam of section.seams) {
    const result = applySeam(polygons, seam, reachIn);
    polygons = result.polygons;
    problems.push(...result.problems);
  }
  return { polygons, problems };
}

function applySeam(polygons: Point[][], seam: Seam, reachIn: number): SplitResult {
  const lengthIn = Math.hypot(seam.b.x - seam.a.x, seam.b.y - seam.a.y);
  if (!(lengthIn > GEOMETRY_EPSILON_IN)) {
    return { polygons, problems: [{ kind: 'seam-crosses-nothing', seamId: seam.id, point: seam.a, message: `seam "${seam.id}" has no length (both ends at ${formatPoint(seam.a)})` }] };
  }
  const problems: SeamProblem[] = [];
  const out: Point[][] = [];
  let crossed = false;
  const full = (c: Chord) => c.from.t >= -reachIn && c.to.t <= lengthIn + reachIn;
  const overlapIn = (c: Chord) => Math.min(c.to.t, lengthIn + reachIn) - Math.max(c.from.t, -reachIn);
  const chordsOf = (ring: Point[]) => lineChords(ring, seam.a, seam.b).filter((c) => overlapIn(c) > reachIn);
  const splitAll = (ring: Point[], chords: Chord[]): Point[][] => {
    for (const chord of chords.filter(full)) {
      const [first, second] = splitRingAtChord(ring, chord);
      if (first.length < 3 || second.length < 3) continue;
      if (polygonArea(first) < MIN_PATCH_AREA_SQ_IN || polygonArea(second) < MIN_PATCH_AREA_SQ_IN) continue;
      crossed = true;
      return [...splitAll(first, chordsOf(first)), ...splitAll(second, chordsOf(second))];
    }
    return [ring];
  };
  for (const ring of polygons) {
    // Most patches lie wholly to one side of the seam line or far from the seam: skip them cheaply.
    if (!lineMayCross(ring, seam, lengthIn, reachIn)) {
      out.push(ring);
      continue;
    }
    const chords = chordsOf(ring);
    for (const chord of chords.filter((c) => !full(c))) {
      const endsInside = chord.from.t < -reachIn ? seam.a : seam.b;
      const gapIn = chord.from.t < -reachIn ? -chord.from.t : chord.to.t - lengthIn;
      problems.push({
        kind: 'seam-stops-short',
        seamId: seam.id,
        point: { x: endsInside.x, y: endsInside.y },
        message: `seam "${seam.id}" ends inside a patch at ${formatPoint(endsInside)}, ${gapIn.toFixed(3)} in. short of its edge; that patch is not split`,
      });
    }
    out.push(...splitAll(ring, chords));
  }
  if (!crossed && problems.length === 0) {
    problems.push({
      kind: 'seam-crosses-nothing',
      seamId: seam.id,
      point: { x: seam.a.x, y: seam.a.y },
      message: `seam "${seam.id}" from ${formatPoint(seam.a)} to ${formatPoint(seam.b)} crosses no patch: it lies outside the section or along an existing line`,
    });
  }
  return { polygons: out, problems };
}

/** Whether the seam (extended by the reach tolerance) can meet the inside of the ring: bounding-box tests only. */
function lineMayCross(ring: readonly Point[], seam: Seam, lengthIn: number, reachIn: number): boolean {
  const b = polygonBounds(ring);
  const ux = (seam.b.x - seam.a.x) / lengthIn;
  const uy = (seam.b.y - seam.a.y) / lengthIn;
  const ax = seam.a.x - ux * reachIn;
  const ay = seam.a.y - uy * reachIn;
  const bx = seam.b.x + ux * reachIn;
  const by = seam.b.y + uy * reachIn;
  if (Math.max(ax, bx) < b.minX || Math.min(ax, bx) > b.maxX || Math.max(ay, by) < b.minY || Math.min(ay, by) > b.maxY) return false;
  let pos = false;
  let neg = false;
  for (const [x, y] of [[b.minX, b.minY], [b.maxX, b.minY], [b.maxX, b.maxY], [b.minX, b.maxY]]) {
    const d = -uy * (x - seam.a.x) + ux * (y - seam.a.y);
    if (d >= 0) pos = true;
    if (d <= 0) neg = true;
  }
  return pos && neg;
}

/**
 * Derives the numbered patches of a section: splits the outline by the seams ({@link splitSection}),
 * then matches the designer's patch assignments (`section.patches`) to the derived patches by their
 * anchor point. Derived patches without an assignment get the lowest numbers not yet used, in the order
 * the splits produced them. Patches come back sorted by number, labelled `<section label><number>`.
 * Never throws for a schema-valid section.
 */
export function derivePatches(section: Section, options: DerivePatchesOptions = {}): { patches: DerivedPatch[]; problems: SeamProblem[] } {
  const split = options.split ?? splitSection(section, options);
  const { polygons } = split;
  const problems = split.problems.slice();
  const assigned: Array<Section['patches'][number] | undefined> = polygons.map(() => undefined);
  section.patches.forEach((assignment, k) => {
    // Assignments written by the board come in split order: try the patch at the same place first.
    let index = k < polygons.length && locatePoint(assignment.anchor, polygons[k]) === 'inside' ? k : -1;
    if (index < 0) index = polygons.findIndex((ring) => locatePoint(assignment.anchor, ring) === 'inside');
    if (index < 0) index = polygons.findIndex((ring) => locatePoint(assignment.anchor, ring) === 'boundary');
    if (index < 0) {
      problems.push({
        kind: 'anchor-outside',
        patchNumber: assignment.number,
        point: assignment.anchor,
        message: `patch ${section.label}${assignment.number}: its anchor ${formatPoint(assignment.anchor)} lies in no patch of section ${section.label}`,
      });
      return;
    }
    const holder = assigned[index];
    if (holder) {
      problems.push({
        kind: 'anchor-shared',
        patchNumber: assignment.number,
        point: assignment.anchor,
        message: `patch ${section.label}${assignment.number}: its anchor ${formatPoint(assignment.anchor)} is in the same patch as ${section.label}${holder.number}'s; ${section.label}${assignment.number} is ignored`,
      });
      return;
    }
    assigned[index] = assignment;
  });
  const used = new Set(assigned.filter((a) => a !== undefined).map((a) => a.number));
  let next = 1;
  const patches: DerivedPatch[] = polygons.map((polygon, i) => {
    const assignment = assigned[i];
    let number: number;
    if (assignment) number = assignment.number;
    else {
      while (used.has(next)) next++;
      number = next;
      used.add(number);
    }
    const patch = withLabelPoint({ index: i, number, label: `${section.label}${number}`, polygon });
    if (assignment?.fabricId) patch.fabricId = assignment.fabricId;
    if (assignment?.stripSet) patch.stripSet = assignment.stripSet;
    return patch;
  });
  patches.sort((p, q) => p.number - q.number);
  return { patches, problems };
}

/** The patches and problems of a section, as {@link derivePatches} gives them with its default tolerances. */
export type PatchDeriver = (section: Section) => { patches: DerivedPatch[]; problems: SeamProblem[] };

/**
 * {@link derivePatches} (default tolerances) that derives each section object once and hands the same
 * result back after: for work that reads many parts of one document (the print set derives every
 * section for its cutting list, copies, templates and booklet). The results are shared, so callers
 * read them and never change them; sections are taken as unchanging while the deriver is in use.
 */
export function rememberingDeriver(): PatchDeriver {
  const memo = new WeakMap<Section, { patches: DerivedPatch[]; problems: SeamProblem[] }>();
  return (section) => {
    let result = memo.get(section);
    if (!result) memo.set(section, (result = derivePatches(section)));
    return result;
  };
}

/**
 * The patch with its `labelPoint` as a property found on first read and then kept (enumerable, so
 * spreads, JSON and structured clones carry the value).
 */
function withLabelPoint(patch: Omit<DerivedPatch, 'labelPoint'>): DerivedPatch {
  let at: Point | undefined;
  return Object.defineProperty(patch, 'labelPoint', { enumerable: true, get: () => (at ??= patchLabelPoint(patch.polygon)) }) as DerivedPatch;
}
