import { SEAM_PRESS_DEFAULT, type PatternDocument, type Section } from '../document/pattern-schema';
import { derivePatches, distanceToSegment, locatePoint, type DerivedPatch } from '../geometry/index';
import { checkSewability, type SewabilityVerdict } from '../sewability/index';
import { SEAM_REACH_TOLERANCE_IN } from '../tolerance';
import type { SeamPressing } from './joining-types';

// A sewing step lies on a seam when both its ends are this near the seam's line (inches).
const ON_SEAM_IN = SEAM_REACH_TOLERANCE_IN;

/**
 * How each patch seam of a section is pressed (docs/pattern-format.md#pressing), resolved against the
 * piecing order (patch numbers ascending): the patch each seam sews on (`addedPatch`), the patch sewn
 * before it across the seam (`previousPatch`), and the patch it is pressed toward — the one just added
 * unless the designer says `previous` or `open`. Toward the patch just added is the usual practice on a
 * foundation (common practice). A seam that sews no patch in the order (the section is not sewable as
 * numbered, past the first failing patch) has no patches. Empty when the section does not exist.
 */
export function seamPressing(doc: Pick<PatternDocument, 'sections'>, sectionId: string): SeamPressing[] {
  const section = doc.sections.find((s) => s.id === sectionId);
  if (!section) return [];
  const { patches } = derivePatches(section);
  return sectionSeamPressing(section, patches, checkSewability(patches));
}

/**
 * {@link seamPressing} of a section whose patches (in piecing order) and sewability verdict are already at
 * hand (the print set works them out once for every section).
 */
export function sectionSeamPressing(section: Section, patches: readonly DerivedPatch[], verdict: SewabilityVerdict): SeamPressing[] {
  const position = new Map(verdict.order.map((n, i) => [n, i]));
  const claimed = new Set<number>();
  return section.seams.map((seam) => {
    const press = seam.press ?? SEAM_PRESS_DEFAULT;
    const lenSq = (seam.b.x - seam.a.x) ** 2 + (seam.b.y - seam.a.y) ** 2;
    const len = Math.sqrt(lenSq);
    const offLine = (p: { x: number; y: number }) => Math.abs((p.x - seam.a.x) * (seam.b.y - seam.a.y) - (p.y - seam.a.y) * (seam.b.x - seam.a.x)) / len;
    const stepIndex = verdict.steps.findIndex((step, k) => {
      if (claimed.has(k) || lenSq === 0) return false;
      const mid = { x: (step.from.x + step.to.x) / 2, y: (step.from.y + step.to.y) / 2 };
      return offLine(step.from) <= ON_SEAM_IN && offLine(step.to) <= ON_SEAM_IN && distanceToSegment(mid, seam.a, seam.b) <= ON_SEAM_IN;
    });
    if (stepIndex < 0) return { seamId: seam.id, press };
    claimed.add(stepIndex);
    const step = verdict.steps[stepIndex];
    const added = step.patchNumber;
    const mid = { x: (step.from.x + step.to.x) / 2, y: (step.from.y + step.to.y) / 2 };
    const previous = patches.find((p) => p.number !== added && (position.get(p.number) ?? Infinity) < (position.get(added) ?? -1) && locatePoint(mid, p.polygon, ON_SEAM_IN) === 'boundary')?.number;
    const toward = press === 'added' ? added : press === 'previous' ? previous : undefined;
    return {
      seamId: seam.id,
      press,
      addedPatch: added,
      ...(previous !== undefined ? { previousPatch: previous } : {}),
      ...(toward !== undefined ? { towardPatch: toward } : {}),
    };
  });
}
