import type { Fabric, PatternDocument, StripSet } from '../../document/pattern-schema';
import { derivePatches, type PatchDeriver } from '../../geometry/index';
import { layoutStripSet } from '../strip-sets/strip-set-layout';
import { YARDAGE_STEP_IN, INCHES_PER_YARD, roundUpToStep } from '../shared/rounding';
import { PolygonOffsetter } from '../seam-allowance/clipper-offset';
import { formatInches } from '../../units/index';
import { patchRoughCut } from './patch-rough-cut';
import { fitRoughCut } from './rough-cut-fit';
import { planWofStrips } from './wof-strips';
import type {
  CuttingList,
  CuttingListFabric,
  CuttingListPatch,
  CuttingListPieceGroup,
  CuttingListProblem,
  CuttingListStripSet,
  CuttingListStripSetStrips,
} from './cutting-list-types';

interface StripSetUse {
  stripSet: StripSet;
  subCutLengthIn: number;
  /** Longest sub-cut the designer set on any patch using the set, or null. */
  designerSubCutIn: number | null;
  /** What each patch needs along the strips with its seam allowance (no margin), for the check of a set sub-cut. */
  needs: Array<{ patchLabel: string; sectionId: string; needIn: number }>;
  sewnWidthIn: number;
  count: number;
  patchLabels: string[];
}

/**
 * The cutting list of a pattern (docs/design-notes.md#cutting-list): per patch the rough-cut rectangle (minimum-area
 * rectangle of patch + allowance + piecing margin, rounded up to ⅛ in.); per fabric the pieces, the
 * strips across its usable WOF (pieces per strip = floor(WOF / piece length)), the strip-set strips, the
 * total strip length and the yardage rounded up to ⅛ yd; every count multiplied by ring repeats and by
 * the block count. Ring-repeat copies are identical, so each section template is measured once.
 *
 * What the designer sets wins over what is computed: a patch's `roughCut` is listed as the piece to cut
 * (with a problem, in plain words, when it cannot cover the patch with its seam allowance in any turn), and
 * a strip set's `subCutLengthIn` as its sub-cut (with a problem when a patch needs longer). Strip sets are
 * spoken of by their name, or "Strip set 1", "Strip set 2" … (their place in the list), never their id.
 * Pure and JSON-serialisable; never throws for a valid document. `derive` gives a section's patches (the
 * print set passes the ones it derived already).
 */
export function buildCuttingList(document: PatternDocument, derive: PatchDeriver = (s) => derivePatches(s)): CuttingList {
  const allowanceIn = document.seamAllowanceIn;
  const marginIn = document.piecingMarginIn;
  const blocks = document.blockCount;
  const patches: CuttingListPatch[] = [];
  const problems: CuttingListProblem[] = [];
  const pieceGroups = new Map<string, Map<string, CuttingListPieceGroup>>();
  const stripSetUses = new Map<string, StripSetUse>();
  const offsetter = new PolygonOffsetter();
  const stripSetRows: Array<{ row: CuttingListPatch; key: string; sewnWidthIn: number }> = [];
  // Problems about a strip set are worded once its list name is known (its place in the list).
  const stripSetProblems: Array<{ key: string; sectionId: string | null; patchLabel: string | null; message: (name: string) => string }> = [];

  for (const section of document.sections) {
    const copies = (section.ringRepeat?.count ?? 1) * blocks;
    const derived = derive(section);
    const assignments = new Map(section.patches.map((a) => [a.number, a]));
    for (const p of derived.problems) problems.push({ sectionId: section.id, patchLabel: null, message: p.message });
    for (const patch of derived.patches) {
      if (patch.stripSet) {
        const layout = layoutStripSet(patch.polygon, patch.stripSet, allowanceIn, marginIn);
        const key = stripSetKey(patch.stripSet);
        const use = stripSetUses.get(key) ?? { stripSet: patch.stripSet, subCutLengthIn: 0, designerSubCutIn: null, needs: [], sewnWidthIn: layout.sewnWidthIn, count: 0, patchLabels: [] };
        use.subCutLengthIn = Math.max(use.subCutLengthIn, layout.computedSubCutLengthIn);
        if (patch.stripSet.subCutLengthIn !== undefined) use.designerSubCutIn = Math.max(use.designerSubCutIn ?? 0, patch.stripSet.subCutLengthIn);
        use.needs.push({ patchLabel: patch.label, sectionId: section.id, needIn: layout.patchExtentAlongIn + 2 * allowanceIn });
        use.count += copies;
        use.patchLabels.push(patch.label);
        stripSetUses.set(key, use);
        if (!layout.coversPatch) {
          const label = patch.label;
          stripSetProblems.push({ key, sectionId: section.id, patchLabel: label, message: (name) => `${name} is narrower than patch ${label} across its strips: widen the outer strips` });
        }
        const row: CuttingListPatch = {
          sectionId: section.id,
          sectionLabel: section.label,
          patchLabel: patch.label,
          patchNumber: patch.number,
          fabricId: null,
          stripSetId: patch.stripSet.id,
          cutWidthIn: Math.min(layout.sewnWidthIn, layout.computedSubCutLengthIn),
          cutLengthIn: Math.max(layout.sewnWidthIn, layout.computedSubCutLengthIn),
          rectangleAngleDeg: round6(layout.axisAngleDeg),
          count: copies,
          roughCutSetByDesigner: false,
        };
        patches.push(row);
        stripSetRows.push({ row, key, sewnWidthIn: layout.sewnWidthIn });
        continue;
      }
      const computed = patchRoughCut(patch.polygon, allowanceIn, marginIn, offsetter);
      const set = assignments.get(patch.number)?.roughCut;
      let cut = { widthIn: computed.widthIn, lengthIn: computed.lengthIn, angleDeg: computed.rectangle.angleDeg };
      if (set) {
        const fit = fitRoughCut(patch.polygon, set, allowanceIn, offsetter);
        cut = { widthIn: Math.min(set.widthIn, set.lengthIn), lengthIn: Math.max(set.widthIn, set.lengthIn), angleDeg: fit.angleDeg };
        if (!fit.covers) {
          problems.push({
            sectionId: section.id,
            patchLabel: patch.label,
            message:
              `the ${formatInches(cut.widthIn, { withUnit: false })} × ${formatInches(cut.lengthIn)} piece set for ${patch.label} does not cover the patch with its ` +
              `${formatInches(allowanceIn)} seam allowance, however it is turned: it needs at least ${formatInches(fit.neededWidthIn, { withUnit: false })} × ${formatInches(fit.neededLengthIn)}`,
          });
        }
      }
      patches.push({
        sectionId: section.id,
        sectionLabel: section.label,
        patchLabel: patch.label,
        patchNumber: patch.number,
        fabricId: patch.fabricId ?? null,
        stripSetId: null,
        cutWidthIn: cut.widthIn,
        cutLengthIn: cut.lengthIn,
        rectangleAngleDeg: round6(cut.angleDeg),
        count: copies,
        roughCutSetByDesigner: set !== undefined,
      });
      if (!patch.fabricId) {
        problems.push({ sectionId: section.id, patchLabel: patch.label, message: `patch ${patch.label} has no fabric: it is left out of the yardage` });
        continue;
      }
      let groups = pieceGroups.get(patch.fabricId);
      if (!groups) pieceGroups.set(patch.fabricId, (groups = new Map()));
      const sizeKey = `${cut.widthIn}x${cut.lengthIn}`;
      const group = groups.get(sizeKey) ?? {
        widthIn: cut.widthIn,
        lengthIn: cut.lengthIn,
        count: 0,
        patchLabels: [],
        stripWidthIn: null,
        pieceLengthIn: null,
        piecesPerStrip: null,
        stripCount: 0,
        lengthwiseIn: 0,
      };
      group.count += copies;
      group.patchLabels.push(patch.label);
      groups.set(sizeKey, group);
    }
  }

  const fabricsById = new Map(document.fabrics.map((f) => [f.id, f]));
  const stripSets: CuttingListStripSet[] = [];
  const stripSetStrips = new Map<string, CuttingListStripSetStrips[]>();
  const idsSeen = new Map<string, number>();
  const listIds = new Map<string, string>();
  const listNames = new Map<string, string>();
  let ordinal = 0;
  for (const [key, use] of stripSetUses) {
    const displayName = stripSetListName(use.stripSet.name, ++ordinal);
    listNames.set(key, displayName);
    // One id used for different strips makes separate sets; the list keeps their ids apart.
    const seen = (idsSeen.get(use.stripSet.id) ?? 0) + 1;
    idsSeen.set(use.stripSet.id, seen);
    const listId = seen === 1 ? use.stripSet.id : `${use.stripSet.id}-${seen}`;
    listIds.set(key, listId);
    if (seen > 1) {
      problems.push({ sectionId: null, patchLabel: use.patchLabels[0] ?? null, message: `${displayName}: another strip set has the same id but different strips; they are listed apart, this one for ${[...new Set(use.patchLabels)].join(', ')}` });
    }
    const subCutLengthIn = use.designerSubCutIn ?? use.subCutLengthIn;
    if (use.designerSubCutIn !== null) {
      for (const need of use.needs) {
        if (use.designerSubCutIn < need.needIn - 1e-9) {
          problems.push({
            sectionId: need.sectionId,
            patchLabel: need.patchLabel,
            message: `${displayName}: the sub-cut of ${formatInches(use.designerSubCutIn)} set for it is shorter than patch ${need.patchLabel} with its seam allowance along the strips (${formatInches(roundUpToStep(need.needIn, 1 / 16), { denominator: 16 })})`,
          });
        }
      }
    }
    const wof = Math.min(...use.stripSet.strips.map((s) => fabricsById.get(s.fabricId)?.usableWofIn ?? 42));
    let subCutsPerSet = Math.floor(wof / subCutLengthIn + 1e-9);
    if (subCutsPerSet < 1) {
      problems.push({ sectionId: null, patchLabel: use.patchLabels[0] ?? null, message: `${displayName}: its sub-cut of ${subCutLengthIn} in. is longer than the usable WOF (${wof} in.); sew the strips along the length of the fabric` });
      subCutsPerSet = 1;
    }
    const setCount = Math.ceil(use.count / subCutsPerSet);
    stripSets.push({
      stripSetId: listId,
      name: use.stripSet.name ?? null,
      displayName,
      strips: use.stripSet.strips.map((s) => ({ fabricId: s.fabricId, finishedWidthIn: s.finishedWidthIn, cutWidthIn: s.finishedWidthIn + 2 * allowanceIn })),
      sewnWidthIn: use.sewnWidthIn,
      subCutLengthIn,
      subCutSetByDesigner: use.designerSubCutIn !== null,
      subCutCount: use.count,
      subCutsPerSet,
      setCount,
      patchLabels: use.patchLabels,
    });
    use.stripSet.strips.forEach((s, stripIndex) => {
      const list = stripSetStrips.get(s.fabricId) ?? [];
      list.push({ stripSetId: listId, stripIndex, finishedWidthIn: s.finishedWidthIn, cutWidthIn: s.finishedWidthIn + 2 * allowanceIn, stripCount: setCount });
      stripSetStrips.set(s.fabricId, list);
    });
  }

  for (const { row, key, sewnWidthIn } of stripSetRows) {
    row.stripSetId = listIds.get(key) ?? row.stripSetId;
    const designed = stripSetUses.get(key)?.designerSubCutIn;
    if (designed != null) {
      row.cutWidthIn = Math.min(sewnWidthIn, designed);
      row.cutLengthIn = Math.max(sewnWidthIn, designed);
    }
  }
  for (const p of stripSetProblems) problems.push({ sectionId: p.sectionId, patchLabel: p.patchLabel, message: p.message(listNames.get(p.key) ?? 'Strip set') });

  const fabrics = document.fabrics.map((f) => fabricCuts(f, [...(pieceGroups.get(f.id)?.values() ?? [])], stripSetStrips.get(f.id) ?? [], problems));
  return {
    title: document.title,
    seamAllowanceIn: allowanceIn,
    piecingMarginIn: marginIn,
    blockCount: blocks,
    patches,
    fabrics,
    stripSets,
    totalYardageIn: fabrics.reduce((s, f) => s + f.yardageIn, 0),
    problems,
  };
}

function fabricCuts(
  fabric: Fabric,
  groups: CuttingListPieceGroup[],
  stripSetStrips: CuttingListStripSetStrips[],
  problems: CuttingListProblem[],
): CuttingListFabric {
  groups.sort((a, b) => b.lengthIn - a.lengthIn || b.widthIn - a.widthIn);
  let fabricLengthIn = 0;
  let stripCount = 0;
  let pieceCount = 0;
  for (const g of groups) {
    pieceCount += g.count;
    const plan = planWofStrips(g, fabric.usableWofIn);
    if (plan) {
      g.stripWidthIn = plan.stripWidthIn;
      g.pieceLengthIn = plan.pieceLengthIn;
      g.piecesPerStrip = plan.piecesPerStrip;
      g.stripCount = plan.stripCount;
      stripCount += plan.stripCount;
      fabricLengthIn += plan.depthIn;
    } else {
      g.lengthwiseIn = g.count * g.lengthIn;
      fabricLengthIn += g.lengthwiseIn;
      problems.push({ sectionId: null, patchLabel: g.patchLabels[0] ?? null, message: `${g.widthIn} × ${g.lengthIn} in. pieces of ${fabric.name} are wider than its usable WOF (${fabric.usableWofIn} in.): cut them along the length` });
    }
  }
  for (const s of stripSetStrips) {
    stripCount += s.stripCount;
    fabricLengthIn += s.stripCount * s.cutWidthIn;
  }
  const yardageIn = roundUpToStep(fabricLengthIn, YARDAGE_STEP_IN);
  return {
    fabricId: fabric.id,
    name: fabric.name,
    colour: fabric.colour,
    usableWofIn: fabric.usableWofIn,
    pieces: groups,
    stripSetStrips,
    pieceCount,
    stripCount,
    totalStripLengthIn: stripCount * fabric.usableWofIn,
    fabricLengthIn: round6(fabricLengthIn),
    yardageIn,
    yardageYd: yardageIn / INCHES_PER_YARD,
    yardageEighths: Math.round(yardageIn / YARDAGE_STEP_IN),
  };
}

/**
 * The name quilters see for a strip set in a list: the designer's name, or "Strip set n" for the n-th set
 * of the list (1-based) — never its id.
 */
export function stripSetListName(name: string | null | undefined, position: number): string {
  return name?.trim() || `Strip set ${position}`;
}

function stripSetKey(s: StripSet): string {
  return `${s.id}|${s.strips.map((st) => `${st.fabricId}:${st.finishedWidthIn}`).join(',')}`;
}

function round6(v: number): number {
  const r = Math.round(v * 1e6) / 1e6;
  return r === 0 ? 0 : r;
}
