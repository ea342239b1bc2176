import type { Fabric, PatternDocument, StripSet } from '../../document/pattern-schema';
import { derivePatches } from '../../geometry/index';
import { layoutStripSet } from '../strip-sets/strip-set-layout';
import { stripSetDisplayName } from '../strip-sets/strip-set-name';
import { YARDAGE_STEP_IN, INCHES_PER_YARD, roundUpToStep } from '../shared/rounding';
import { PolygonOffsetter } from '../seam-allowance/clipper-offset';
import { patchRoughCut } from './patch-rough-cut';
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
 * Pure and JSON-serialisable; never throws for a valid document.
 */
export function buildCuttingList(document: PatternDocument): CuttingList {
  const allowanceIn = document.seamAllowanceIn;
  const marginIn = document.piecingMarginIn;
  const blocks = document.blockCount;
  const patches: CuttingListPatch[] = [];
  const problems: CuttingListProblem[] = [];
  const pieceGroups = new Map<string, Map<string, CuttingListPieceGroup>>();
  const stripSetUses = new Map<string, StripSetUse>();
  const offsetter = new PolygonOffsetter();
  const stripSetRows: Array<{ row: CuttingListPatch; key: string }> = [];

  for (const section of document.sections) {
    const copies = (section.ringRepeat?.count ?? 1) * blocks;
    const derived = derivePatches(section);
    for (const p of derived.problems) problems.push({ sectionId: section.id, patchLabel: null, message: p.message });
    for (const patch of derived.patches) {
      if (patch.stripSet) {
        const layout = layoutStripSet(patch.polygon, patch.stripSet, allowanceIn, marginIn);
        const key = stripSetKey(patch.stripSet);
        const use = stripSetUses.get(key) ?? { stripSet: patch.stripSet, subCutLengthIn: 0, sewnWidthIn: layout.sewnWidthIn, count: 0, patchLabels: [] };
        use.subCutLengthIn = Math.max(use.subCutLengthIn, layout.subCutLengthIn);
        use.count += copies;
        use.patchLabels.push(patch.label);
        stripSetUses.set(key, use);
        if (!layout.coversPatch) {
          problems.push({ sectionId: section.id, patchLabel: patch.label, message: `${stripSetDisplayName(patch.stripSet.name, [patch.label])} is narrower than patch ${patch.label} across its strips: widen the outer strips` });
        }
        const row: CuttingListPatch = {
          sectionId: section.id,
          sectionLabel: section.label,
          patchLabel: patch.label,
          patchNumber: patch.number,
          fabricId: null,
          stripSetId: patch.stripSet.id,
          cutWidthIn: Math.min(layout.sewnWidthIn, layout.subCutLengthIn),
          cutLengthIn: Math.max(layout.sewnWidthIn, layout.subCutLengthIn),
          rectangleAngleDeg: round6(layout.axisAngleDeg),
          count: copies,
        };
        patches.push(row);
        stripSetRows.push({ row, key });
        continue;
      }
      const cut = patchRoughCut(patch.polygon, allowanceIn, marginIn, offsetter);
      patches.push({
        sectionId: section.id,
        sectionLabel: section.label,
        patchLabel: patch.label,
        patchNumber: patch.number,
        fabricId: patch.fabricId ?? null,
        stripSetId: null,
        cutWidthIn: cut.widthIn,
        cutLengthIn: cut.lengthIn,
        rectangleAngleDeg: round6(cut.rectangle.angleDeg),
        count: copies,
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
  for (const [key, use] of stripSetUses) {
    // One id used for different strips makes separate sets; the list keeps their ids apart.
    const seen = (idsSeen.get(use.stripSet.id) ?? 0) + 1;
    idsSeen.set(use.stripSet.id, seen);
    const listId = seen === 1 ? use.stripSet.id : `${use.stripSet.id}-${seen}`;
    listIds.set(key, listId);
    if (seen > 1) {
      problems.push({ sectionId: null, patchLabel: use.patchLabels[0] ?? null, message: `strip set id "${use.stripSet.id}" is used for different strips; listed as "${listId}" for ${[...new Set(use.patchLabels)].join(', ')}` });
    }
    const wof = Math.min(...use.stripSet.strips.map((s) => fabricsById.get(s.fabricId)?.usableWofIn ?? 42));
    let subCutsPerSet = Math.floor(wof / use.subCutLengthIn + 1e-9);
    if (subCutsPerSet < 1) {
      problems.push({ sectionId: null, patchLabel: use.patchLabels[0] ?? null, message: `${stripSetDisplayName(use.stripSet.name, use.patchLabels)}: its sub-cut of ${use.subCutLengthIn} in. is longer than the usable WOF (${wof} in.); sew the strips along the length of the fabric` });
      subCutsPerSet = 1;
    }
    const setCount = Math.ceil(use.count / subCutsPerSet);
    stripSets.push({
      stripSetId: listId,
      name: use.stripSet.name ?? null,
      strips: use.stripSet.strips.map((s) => ({ fabricId: s.fabricId, finishedWidthIn: s.finishedWidthIn, cutWidthIn: s.finishedWidthIn + 2 * allowanceIn })),
      sewnWidthIn: use.sewnWidthIn,
      subCutLengthIn: use.subCutLengthIn,
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

  for (const { row, key } of stripSetRows) row.stripSetId = listIds.get(key) ?? row.stripSetId;

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

function stripSetKey(s: StripSet): string {
  return `${s.id}|${s.strips.map((st) => `${st.fabricId}:${st.finishedWidthIn}`).join(',')}`;
}

function round6(v: number): number {
  const r = Math.round(v * 1e6) / 1e6;
  return r === 0 ? 0 : r;
}
