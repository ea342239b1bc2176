import type { PatternDocument, Section } from '../../document/pattern-schema';
import { derivePatches, type DerivedPatch } from '../../geometry/index';
import { layoutStripSet, type StripSetLayout } from './strip-set-layout';
import { stripSetDisplayName } from './strip-set-name';

/** The strip set laid on one patch of a section, with its guide lines. */
export interface PatchStripSet {
  sectionId: string;
  /** Patch label as quilters write it: `B1`. */
  patchLabel: string;
  patchNumber: number;
  layout: StripSetLayout;
  /** Problems the designer should fix (outer strips too narrow, a strip seam that misses the patch). */
  problems: string[];
}

/**
 * The strip-set patches of a section as drawn (ring-repeat copy 0, which is the template), each with the
 * guide lines where its strip seams must land. `allowanceIn` and `marginIn` set the cut widths and sub-cut.
 */
export function sectionStripSets(section: Section, allowanceIn = 0.25, marginIn = 0.5, patches?: DerivedPatch[]): PatchStripSet[] {
  const derived = patches ?? derivePatches(section).patches;
  const out: PatchStripSet[] = [];
  for (const patch of derived) {
    if (!patch.stripSet) continue;
    const layout = layoutStripSet(patch.polygon, patch.stripSet, allowanceIn, marginIn);
    const problems: string[] = [];
    const name = stripSetDisplayName(layout.stripSetName, [patch.label]);
    if (!layout.coversPatch) {
      const span = layout.patchAcross.maxIn - layout.patchAcross.minIn;
      problems.push(
        `${name} on patch ${patch.label} is ${fmt(layout.finishedWidthIn)} in. wide but the patch spans ` +
          `${fmt(span)} in. across its strips (from ${fmt(layout.patchAcross.minIn)} to ${fmt(layout.patchAcross.maxIn)} in. ` +
          `about its centre line): widen the outer strips or move the set`,
      );
    }
    for (const g of layout.guideLines) {
      if (g.segments.length === 0) {
        problems.push(`strip seam ${g.seamNumber} of ${name} falls outside patch ${patch.label}: a strip does not show`);
      }
    }
    out.push({ sectionId: section.id, patchLabel: patch.label, patchNumber: patch.number, layout, problems });
  }
  return out;
}

/** Every strip-set patch of the pattern with its guide lines, section by section (templates as drawn). */
export function patternStripSets(document: Pick<PatternDocument, 'sections' | 'seamAllowanceIn' | 'piecingMarginIn'>): PatchStripSet[] {
  return document.sections.flatMap((s) => sectionStripSets(s, document.seamAllowanceIn, document.piecingMarginIn));
}

function fmt(v: number): string {
  return String(Math.round(v * 1000) / 1000);
}
