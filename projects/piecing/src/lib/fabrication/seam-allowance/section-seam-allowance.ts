import type { Point, Section, SectionGeometry } from '../../document/pattern-schema';
import { CHORD_TOLERANCE_IN } from '../../tolerance';
import { flattenSectionOutline, flattenSectionRings, signedArea } from '../../geometry/index';
import { fromIntegerRing, offsetIntegerRings, PolygonOffsetter, toIntegerRing, type OffsetOptions } from './clipper-offset';

/** Default seam allowance, in inches (common practice: ¼ in.). */
export const DEFAULT_SEAM_ALLOWANCE_IN = 0.25;

/** The two lines printed on a section template. */
export interface SectionSeamAllowance {
  /** The seam allowance used, in inches. */
  allowanceIn: number;
  /** The sewing line: the section outline, arcs flattened to chords. */
  sewingLine: Point[];
  /** The cutting line: the sewing line offset outward by the allowance (mitre joins with the mitre limit). */
  cuttingLine: Point[];
  /** Holes of a full-circle arc section (an annulus): its inner circle and the cutting line inside it. */
  holes: Array<{ sewingLine: Point[]; cuttingLine: Point[] }>;
}

/** Settings for {@link sectionSeamAllowance}. */
export interface SeamAllowanceOptions extends OffsetOptions {
  /** Chord tolerance for flattening arcs, in inches. */
  chordToleranceIn?: number;
}

// Results depend only on the geometry and the settings, so they are kept per geometry object: a document
// section is converted to clipper-lib's integers and offset once, however often its template is drawn.
const cache = new WeakMap<SectionGeometry, Map<string, SectionSeamAllowance>>();

/**
 * The sewing line and the cutting line of a section, `allowanceIn` outside it (default ¼ in.). On arc
 * edges the cutting line stays within the chord tolerance of the exact arcs of radius r ± allowance:
 * the sewing line's chords lie within the tolerance of radius r, and their offsets within it of r ± d.
 * Results are cached per geometry object; each call returns fresh arrays.
 */
export function sectionSeamAllowance(
  section: Pick<Section, 'geometry'>,
  allowanceIn = DEFAULT_SEAM_ALLOWANCE_IN,
  options: SeamAllowanceOptions = {},
): SectionSeamAllowance {
  if (!(allowanceIn >= 0) || !Number.isFinite(allowanceIn)) {
    throw new RangeError(`seam allowance must be zero or more inches, got ${allowanceIn}`);
  }
  const key = `${allowanceIn}|${options.chordToleranceIn ?? ''}|${options.mitreLimit ?? ''}|${options.arcToleranceIn ?? ''}`;
  let perGeometry = cache.get(section.geometry);
  if (!perGeometry) {
    perGeometry = new Map();
    cache.set(section.geometry, perGeometry);
  }
  let result = perGeometry.get(key);
  if (!result) {
    result = computeSeamAllowance(section.geometry, allowanceIn, options);
    perGeometry.set(key, result);
  }
  return copyResult(result);
}

/** The cutting line of a section (its outline offset by `allowanceIn`, default ¼ in.), in inches. */
export function sectionCuttingLine(section: Pick<Section, 'geometry'>, allowanceIn = DEFAULT_SEAM_ALLOWANCE_IN): Point[] {
  return sectionSeamAllowance(section, allowanceIn).cuttingLine;
}

/** The sewing line of a section: its outline with arcs flattened to chords. */
export function sectionSewingLine(section: Pick<Section, 'geometry'>, chordToleranceIn = CHORD_TOLERANCE_IN): Point[] {
  return flattenSectionOutline(section.geometry, chordToleranceIn);
}

function computeSeamAllowance(geometry: SectionGeometry, allowanceIn: number, options: SeamAllowanceOptions): SectionSeamAllowance {
  const tolerance = options.chordToleranceIn ?? CHORD_TOLERANCE_IN;
  const rings = flattenSectionRings(geometry, tolerance);
  if (rings.holes.length === 0) {
    // One outline: from inches to the grid and back once, wound like the outline.
    const cuttingLine = new PolygonOffsetter(options).offsetPolygon(rings.outer, allowanceIn, 'mitre');
    return { allowanceIn, sewingLine: rings.outer, cuttingLine, holes: [] };
  }
  const outerSign = Math.sign(signedArea(rings.outer));
  const integerRings = [toIntegerRing(rings.outer), ...rings.holes.map(toIntegerRing)];
  const offsetRings = offsetIntegerRings(integerRings, allowanceIn, 'mitre', options).map(fromIntegerRing);
  // The outer result ring is the largest; holes come out wound the other way.
  let outer: Point[] = [];
  let outerArea = 0;
  const holeRings: Point[][] = [];
  for (const ring of offsetRings) {
    const area = signedArea(ring);
    if (Math.abs(area) > outerArea) {
      if (outer.length > 0) holeRings.push(outer);
      outer = ring;
      outerArea = Math.abs(area);
    } else {
      holeRings.push(ring);
    }
  }
  if (outer.length > 0 && Math.sign(signedArea(outer)) !== outerSign) outer.reverse();
  const holes = rings.holes.map((sewingLine, i) => {
    const cutting = holeRings[i] ?? [];
    if (cutting.length > 0 && Math.sign(signedArea(cutting)) === outerSign) cutting.reverse();
    return { sewingLine, cuttingLine: cutting };
  });
  return { allowanceIn, sewingLine: rings.outer, cuttingLine: outer, holes };
}

function copyResult(r: SectionSeamAllowance): SectionSeamAllowance {
  const copy = (ring: Point[]) => ring.map((p) => ({ x: p.x, y: p.y }));
  return {
    allowanceIn: r.allowanceIn,
    sewingLine: copy(r.sewingLine),
    cuttingLine: copy(r.cuttingLine),
    holes: r.holes.map((h) => ({ sewingLine: copy(h.sewingLine), cuttingLine: copy(h.cuttingLine) })),
  };
}
