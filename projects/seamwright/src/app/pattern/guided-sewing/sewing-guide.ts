import {
  buildCuttingList,
  checkSewability,
  derivePatches,
  expandRingRepeat,
  formatInches,
  stripSetDisplayName,
  type CuttingList,
  type DerivedPatch,
  type PatternDocument,
  type Section,
} from '@seamwright/piecing';
import type { GuidePiece, JoinGuideStep, PieceStep, SectionGuide, SewingGuide, TrimStep } from './sewing-guide-types';
import { copiesOf } from '../sewing-log/sewing-progress';

const inches = (n: number) => formatInches(n, { style: 'unicode', denominator: 8 });
const size = (w: number, l: number) => `${formatInches(w, { style: 'unicode', withUnit: false })} × ${inches(l)}`;

/** Which way a patch seam is pressed, as the document says (docs/pattern-format.md); `added` when unset. */
type PatchPress = 'added' | 'previous' | 'open';

/**
 * Pressing words for a patch just sewn. Toward the patch just added is the default and the usual practice
 * on a foundation (docs/design-notes.md, design §5.9).
 */
export function pressWords(press: PatchPress, patchLabel: string): string {
  if (press === 'open') return 'Press the seam open.';
  if (press === 'previous') return `Press the seam toward the patches sewn before ${patchLabel}.`;
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
      press: i === 0 ? null : pressWords(pressOfPatch(section, patch), patch.label),
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

/**
 * The press the document sets for the seam that adds `patch`. Until the piecing library answers per seam,
 * every patch takes the default (toward the patch just added).
 */
function pressOfPatch(_section: Section, _patch: DerivedPatch): PatchPress {
  return 'added';
}

/** Stand-in joins until the joining plan is available: one step joining the sections in document order. */
function plainJoins(doc: PatternDocument): JoinGuideStep[] {
  if (doc.sections.length < 2) return [];
  const labels = doc.sections.map((s) => s.label);
  return [
    {
      number: 1,
      kind: 'join',
      label: `Join sections ${labels.join(', ')} into the block`,
      partA: labels.slice(0, -1).join(', '),
      partB: labels[labels.length - 1],
      sectionIds: doc.sections.map((s) => s.id),
      seamPaths: [],
      seamText: 'Join the trimmed sections as the print set shows.',
      press: 'Press as the print set shows.',
      marks: [],
    },
  ];
}

/** Guided sewing for a whole pattern: the sections in joining order, then the joins. */
export function buildSewingGuide(doc: PatternDocument): SewingGuide {
  const list = buildCuttingList(doc);
  const joins = plainJoins(doc);
  const fabrics = new Map(doc.fabrics.map((f) => [f.id, f.colour]));
  const blockPatches = doc.sections.flatMap((s) =>
    expandRingRepeat(s).flatMap((copy) =>
      derivePatches(copy).patches.map((p) => ({ sectionId: s.id, polygon: p.polygon, colour: p.fabricId ? (fabrics.get(p.fabricId) ?? null) : null })),
    ),
  );
  return {
    sections: doc.sections.map((s) => sectionGuide(doc, s, list)),
    joins,
    joinsPlanned: false,
    blockCount: doc.blockCount,
    blockPatches,
    problems: [],
  };
}
