import {
  buildCuttingList,
  checkSewability,
  derivePatches,
  expandRingRepeat,
  formatInches,
  seamPressing,
  stripSetDisplayName,
  type CuttingList,
  type DerivedPatch,
  type PatternDocument,
  type Section,
} from '@seamwright/piecing';
import type { GuidePiece, PieceStep, SectionGuide, SewingGuide, TrimStep } from './sewing-guide-types';
import { copiesOf } from '../sewing-log/sewing-progress';
import { guidedJoins } from './guided-joins';

const inches = (n: number) => formatInches(n, { style: 'unicode', denominator: 8 });
const size = (w: number, l: number) => `${formatInches(w, { style: 'unicode', withUnit: false })} × ${inches(l)}`;

/** Which way a patch seam is pressed, as the document says (docs/pattern-format.md#pressing). */
type PatchPress = 'added' | 'previous' | 'open';

/**
 * Pressing words for a patch just sewn. Toward the patch just added is the default and the usual practice
 * on a foundation (design §5.9); `previous` presses toward the patch sewn before across the seam.
 */
export function pressWords(press: PatchPress, patchLabel: string, previousLabel?: string): string {
  if (press === 'open') return 'Press the seam open.';
  if (press === 'previous') return `Press the seam toward ${previousLabel ?? 'the patches sewn before'}, away from ${patchLabel}.`;
  return `Press ${patchLabel} over, the seam toward ${patchLabel} (the patch just added).`;
}

/** What to cut the piece of one patch from, with its size from the cutting list. */
function pieceOf(doc: PatternDocument, list: CuttingList, section: Section, patch: DerivedPatch): GuidePiece {
  const row = list.patches.find((p) => p.sectionId === section.id && p.patchNumber === patch.number);
  const fabrics = new Map(doc.fabrics.map((f) => [f.id, f]));
  if (patch.stripSet) {
    const set = list.stripSets.find((s) => s.stripSetId === row?.stripSetId);
    const name = stripSetDisplayName(patch.stripSet.name ?? set?.name, set?.patchLabels ?? [patch.label]);
    return {
      kind: 'strip-set',
      name,
      colour: null,
      strips: patch.stripSet.strips.map((s) => ({ name: fabrics.get(s.fabricId)?.name ?? 'Fabric', colour: fabrics.get(s.fabricId)?.colour ?? '#cccccc' })),
      sizeText: row ? `a slice of ${name}, ${size(row.cutWidthIn, row.cutLengthIn)}` : `a slice of ${name}`,
    };
  }
  const fabric = patch.fabricId ? fabrics.get(patch.fabricId) : undefined;
  if (!fabric) return { kind: 'none', name: 'No fabric chosen', colour: null, strips: [], sizeText: row ? size(row.cutWidthIn, row.cutLengthIn) : '' };
  return { kind: 'fabric', name: fabric.name, colour: fabric.colour, strips: [], sizeText: row ? size(row.cutWidthIn, row.cutLengthIn) : '' };
}

/** The piecing steps of one section, in piecing order, then its trimming. */
export function sectionGuide(doc: PatternDocument, section: Section, list: CuttingList = buildCuttingList(doc)): SectionGuide {
  const { patches } = derivePatches(section);
  const ordered = [...patches].sort((a, b) => a.number - b.number);
  const verdict = checkSewability(ordered);
  const lines = new Map(verdict.steps.map((s) => [s.patchNumber, { from: s.from, to: s.to }]));
  const allowance = inches(doc.seamAllowanceIn);
  // The library resolves each seam against the piecing order: the patch it sews on and how it is pressed.
  const pressing = new Map(seamPressing(doc, section.id).filter((p) => p.addedPatch !== undefined).map((p) => [p.addedPatch!, p]));
  const labelOf = (n: number | undefined) => ordered.find((p) => p.number === n)?.label;
  const pieceSteps: PieceStep[] = ordered.map((patch, i) => {
    const next = ordered[i + 1];
    const failed = verdict.failure && verdict.failure.patchNumber === patch.number ? verdict.failure.message : null;
    return {
      kind: 'piece',
      position: i + 1,
      patchNumber: patch.number,
      patchLabel: patch.label,
      patchIndex: patch.index,
      piece: pieceOf(doc, list, section, patch),
      sewLine: i === 0 ? null : (lines.get(patch.number) ?? null),
      press: i === 0 ? null : pressWords(pressing.get(patch.number)?.press ?? 'added', patch.label, labelOf(pressing.get(patch.number)?.previousPatch)),
      preTrim: next ? `Fold the paper back on the line between ${patch.label} and ${next.label} and trim the fabric ${allowance} beyond it.` : null,
      caution: failed,
    };
  });
  const trim: TrimStep = {
    kind: 'trim',
    text: `Trim the pieced section ${section.label} on its outer cutting line, ${allowance} beyond the sewing line all round: straight edges with a ruler and rotary cutter, curved edges with scissors.`,
  };
  return {
    id: section.id,
    label: section.label,
    copies: copiesOf(section, doc.blockCount),
    ringCount: section.ringRepeat?.count ?? 1,
    note: section.note?.trim() || null,
    patches,
    steps: [...pieceSteps, trim],
  };
}

/** Guided sewing for a whole pattern: the sections in joining order, then the joins. */
export function buildSewingGuide(doc: PatternDocument): SewingGuide {
  const list = buildCuttingList(doc);
  const plan = guidedJoins(doc);
  const byId = new Map(doc.sections.map((s) => [s.id, s]));
  const fabrics = new Map(doc.fabrics.map((f) => [f.id, f.colour]));
  const blockPatches = doc.sections.flatMap((s) =>
    expandRingRepeat(s).flatMap((copy) =>
      derivePatches(copy).patches.map((p) => ({ sectionId: s.id, polygon: p.polygon, colour: p.fabricId ? (fabrics.get(p.fabricId) ?? null) : null })),
    ),
  );
  return {
    sections: plan.sectionOrder.map((id) => sectionGuide(doc, byId.get(id)!, list)),
    joins: plan.joins,
    joinsAreDefault: plan.isDefault,
    blockCount: doc.blockCount,
    blockPatches,
    problems: plan.problems,
  };
}
