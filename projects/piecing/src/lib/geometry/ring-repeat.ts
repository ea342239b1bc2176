import type { Point, Section, SectionGeometry } from '../document/pattern-schema';
import { degToRad, radToDeg, rotatePoint } from './vector';

/** One placement of a ring-repeated section: copy `index` (0 is the drawn section) turned by `angleDeg`. */
export interface RingTransform {
  index: number;
  angleDeg: number;
  angleRad: number;
  centre: Point;
}

/**
 * The placements of a section's ring repeat: `count` turns about the centre, 360/count degrees apart,
 * starting with the section as drawn (0°). A section without a ring repeat has one placement, 0°.
 */
export function ringRepeatTransforms(section: Pick<Section, 'ringRepeat'>): RingTransform[] {
  const repeat = section.ringRepeat;
  if (!repeat) return [{ index: 0, angleDeg: 0, angleRad: 0, centre: { x: 0, y: 0 } }];
  const stepDeg = 360 / repeat.count;
  return Array.from({ length: repeat.count }, (_, index) => ({
    index,
    angleDeg: index * stepDeg,
    angleRad: degToRad(index * stepDeg),
    centre: { x: repeat.centre.x, y: repeat.centre.y },
  }));
}

/** Normalises an angle to [0, 360) degrees. */
export function normaliseAngleDeg(angleDeg: number): number {
  const a = angleDeg % 360;
  return a < 0 ? a + 360 : a;
}

/** The section geometry turned by `angleRad` about `centre`. */
export function rotateGeometry(geometry: SectionGeometry, centre: Point, angleRad: number): SectionGeometry {
  const angleDeg = radToDeg(angleRad);
  const turnAngle = (a: number) => (angleRad === 0 ? a : normaliseAngleDeg(a + angleDeg));
  switch (geometry.kind) {
    case 'straight':
      // A turn keeps the sense of every curve, so the bulges stay as they are.
      return {
        kind: 'straight',
        vertices: geometry.vertices.map((v) => rotatePoint(v, centre, angleRad)),
        ...(geometry.bulges ? { bulges: geometry.bulges.slice() } : {}),
      };
    case 'arc':
      return {
        ...geometry,
        centre: rotatePoint(geometry.centre, centre, angleRad),
        startAngleDeg: turnAngle(geometry.startAngleDeg),
      };
    case 'wedge':
      return {
        ...geometry,
        centre: rotatePoint(geometry.centre, centre, angleRad),
        startAngleDeg: turnAngle(geometry.startAngleDeg),
      };
  }
}

/** The whole section (outline, seams, patch anchors, strip-set directions) turned by `angleRad` about `centre`. */
export function rotateSection(section: Section, centre: Point, angleRad: number): Section {
  const angleDeg = radToDeg(angleRad);
  return {
    ...section,
    geometry: rotateGeometry(section.geometry, centre, angleRad),
    seams: section.seams.map((s) => ({ ...s, a: rotatePoint(s.a, centre, angleRad), b: rotatePoint(s.b, centre, angleRad) })),
    patches: section.patches.map((p) => ({
      ...p,
      anchor: rotatePoint(p.anchor, centre, angleRad),
      ...(p.stripSet ? { stripSet: { ...p.stripSet, strips: p.stripSet.strips.map((st) => ({ ...st })), axisAngleDeg: angleRad === 0 ? p.stripSet.axisAngleDeg : normaliseAngleDeg(p.stripSet.axisAngleDeg + angleDeg) } } : {}),
    })),
  };
}

/**
 * The copies of a ring-repeated section, one per {@link ringRepeatTransforms} placement, each without a
 * ring repeat of its own. Copy 0 keeps the section's id; copy k (k ≥ 1) gets the id `<id>_r<k+1>`. All
 * copies keep the section label: they are the same template sewn several times. A section without a ring
 * repeat comes back as a one-element array (a copy, without `ringRepeat`).
 */
export function expandRingRepeat(section: Section): Section[] {
  const { ringRepeat: _repeat, ...rest } = section;
  const base: Section = rest;
  return ringRepeatTransforms(section).map((t) => {
    const copy = t.index === 0 ? rotateSection(base, t.centre, 0) : rotateSection(base, t.centre, t.angleRad);
    return t.index === 0 ? copy : { ...copy, id: `${section.id}_r${t.index + 1}` };
  });
}
