import type { GuideDrawing } from './guide-drawing';
import type { JoinGuideStep, SectionGuide, SectionStep, SewingGuide } from './sewing-guide-types';

/**
 * A section's picture for one step, mirrored like the foundation: the quilter sees the printed side.
 * Patches before the step are sewn (ticked), the step's patch is outlined and marked "here", later ones
 * are blank; the line to sew is dashed. For trimming every patch is sewn.
 */
export function sectionDrawing(section: SectionGuide, step: SectionStep): GuideDrawing {
  const current = step.kind === 'piece' ? step.patchNumber : Number.POSITIVE_INFINITY;
  return {
    mirrored: true,
    shapes: section.patches.map((p) => {
      const state = p.number < current ? 'done' : p.number === current ? 'current' : 'todo';
      return {
        polygon: p.polygon,
        fill: state === 'todo' ? null : fillOf(section, p.index),
        state,
        label: state === 'done' ? `${p.label} ✓` : state === 'current' ? `${p.label} here` : p.label,
        labelAt: p.labelPoint,
      };
    }),
    lines: step.kind === 'piece' && step.sewLine ? [[step.sewLine.from, step.sewLine.to]] : [],
    marks: [],
  };
}

/** The colour a patch is drawn in: its fabric, or the first strip of its strip set. */
function fillOf(section: SectionGuide, patchIndex: number): string | null {
  const step = section.steps.find((s) => s.kind === 'piece' && s.patchIndex === patchIndex);
  if (!step || step.kind !== 'piece') return null;
  return step.piece.colour ?? step.piece.strips[0]?.colour ?? null;
}

/** The picture of a section step in words. */
export function sectionPictureWords(section: SectionGuide, step: SectionStep): string {
  const mirror = `Section ${section.label} as the printed side of the foundation shows it (mirror image)`;
  if (step.kind === 'trim') return `${mirror}, every patch sewn.`;
  const done = section.patches.filter((p) => p.number < step.patchNumber).map((p) => p.label);
  const sewn = done.length > 0 ? `${done.join(', ')} sewn; ` : '';
  const line = step.sewLine ? '; the dashed line is the line to sew' : '';
  return `${mirror}: ${sewn}${step.patchLabel} to place now, outlined and marked "here"${line}.`;
}

/** The block from the front for one join: the joined sections in colour, the rest faint, the seam dashed, marks as rings. */
export function joinDrawing(guide: SewingGuide, join: JoinGuideStep): GuideDrawing {
  return {
    mirrored: false,
    shapes: guide.blockPatches.map((p) => ({
      polygon: p.polygon,
      fill: p.colour,
      state: join.sectionIds.includes(p.sectionId) ? 'done' : 'context',
    })),
    lines: join.seamPaths,
    marks: join.marks,
  };
}

/** The picture of a join in words. */
export function joinPictureWords(join: JoinGuideStep): string {
  const marks = join.marks.length > 0 ? `, ${join.marks.length} matching marks as rings` : '';
  const seam = join.seamPaths.length > 0 ? '; the seam is dashed' : '';
  return `The block from the front: ${join.partA} and ${join.partB} in colour${seam}${marks}.`;
}
