import { MAX_SIZE_IN, type PatchAssignment, type PatternDocument, type Section, type StripSet } from '@seamwright/piecing';
import { matchedAssignment } from '../analysis/board-patch';
import type { SectionAnalysis } from '../analysis/section-analysis';
import { materialiseAssignments } from './patch-assignments';
import { findSection, replaceSection } from './section-commands';

/*
 * Cutting the way designers write it: a patch's rough-cut piece set by hand, a piece template asked
 * for, a strip set's sub-cut length. Each is a pure function of the document; one asked for something
 * it cannot do returns the document it was given (the store then records nothing).
 */

/** A rough-cut piece the designer sets for a patch (e.g. 3 × 3 in.). */
export type RoughCutPiece = NonNullable<PatchAssignment['roughCut']>;

/** Why a rough cut cannot be set, in words, or null when it can. */
export function roughCutProblem(piece: RoughCutPiece): string | null {
  for (const v of [piece.widthIn, piece.lengthIn]) {
    if (!Number.isFinite(v) || v <= 0) return 'a rough-cut piece needs a width and a length greater than nothing';
    if (v > MAX_SIZE_IN) return `a rough-cut piece is at most ${MAX_SIZE_IN} in. each way`;
  }
  return null;
}

/**
 * Changes the assignment of one derived patch (by its index) and keeps every other assignment as it
 * is. A patch without an assignment gets one at its label point; when some assignment lies in no patch
 * the section's assignments are written afresh from what the board shows (details kept).
 */
function changeAssignment(
  document: PatternDocument,
  sectionId: string,
  patchIndex: number,
  analysis: SectionAnalysis,
  change: (a: PatchAssignment) => PatchAssignment,
): PatternDocument {
  const section = findSection(document, sectionId);
  if (!section) return document;
  let derived;
  try {
    derived = analysis.derive(section);
  } catch {
    return document;
  }
  const patch = derived[patchIndex];
  if (!patch) return document;
  const matched = new Set(derived.map((p) => matchedAssignment(section, p)).filter((a) => a !== undefined));
  let patches: PatchAssignment[];
  if (matched.size === section.patches.length) {
    const own = matchedAssignment(section, patch);
    const fresh = materialiseAssignments([patch])[0];
    patches = own ? section.patches.map((a) => (a === own ? change(a) : a)) : [...section.patches, change(fresh)];
  } else {
    patches = materialiseAssignments(derived);
    patches[patchIndex] = change(patches[patchIndex]);
  }
  const next = replaceSection(document, sectionId, (s): Section => ({ ...s, patches }));
  const before = JSON.stringify(section.patches);
  return JSON.stringify(findSection(next, sectionId)?.patches) === before ? document : next;
}

/** Sets the rough-cut piece of a patch (undefined goes back to the computed one); an invalid piece is refused. */
export function setPatchRoughCut(document: PatternDocument, sectionId: string, patchIndex: number, piece: RoughCutPiece | undefined, analysis: SectionAnalysis): PatternDocument {
  if (piece && roughCutProblem(piece) !== null) return document;
  return changeAssignment(document, sectionId, patchIndex, analysis, (a) => {
    const { roughCut: _old, ...rest } = a;
    return piece ? { ...rest, roughCut: { widthIn: piece.widthIn, lengthIn: piece.lengthIn } } : rest;
  });
}

/** Asks for (or no longer asks for) a piece template of a patch; not asking is stored as no value. */
export function setPatchPieceTemplate(document: PatternDocument, sectionId: string, patchIndex: number, pieceTemplate: boolean, analysis: SectionAnalysis): PatternDocument {
  return changeAssignment(document, sectionId, patchIndex, analysis, (a) => {
    const { pieceTemplate: _old, ...rest } = a;
    return pieceTemplate ? { ...rest, pieceTemplate: true } : rest;
  });
}

/**
 * Sets the length of each slice cut across a strip set (every patch it fills); undefined lets the
 * cutting list compute it. A length that is not positive or exceeds the format's limit is refused.
 */
export function setStripSetSubCutLength(document: PatternDocument, stripSetId: string, lengthIn: number | undefined): PatternDocument {
  if (lengthIn !== undefined && !(Number.isFinite(lengthIn) && lengthIn > 0 && lengthIn <= MAX_SIZE_IN)) return document;
  let changed = false;
  const change = (set: StripSet): StripSet => {
    if (set.subCutLengthIn === lengthIn) return set;
    changed = true;
    const { subCutLengthIn: _old, ...rest } = set;
    return lengthIn === undefined ? rest : { ...rest, subCutLengthIn: lengthIn };
  };
  const sections = document.sections.map((s) => {
    if (!s.patches.some((p) => p.stripSet?.id === stripSetId)) return s;
    return { ...s, patches: s.patches.map((p) => (p.stripSet?.id === stripSetId ? { ...p, stripSet: change(p.stripSet) } : p)) };
  });
  return changed ? { ...document, sections } : document;
}
