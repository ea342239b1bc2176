import { locatePoint, type PatchAssignment, type Section } from '@seamwright/piecing';
import type { BoardPatch } from '../analysis/board-patch';
import type { SectionAnalysis } from '../analysis/section-analysis';

function assignmentOf(p: BoardPatch, number: number): PatchAssignment {
  const a: PatchAssignment = { number, anchor: { x: p.labelPoint.x, y: p.labelPoint.y } };
  if (p.fabricId) a.fabricId = p.fabricId;
  if (p.stripSet) a.stripSet = p.stripSet;
  if (p.roughCut) a.roughCut = p.roughCut;
  if (p.pieceTemplate !== undefined) a.pieceTemplate = p.pieceTemplate;
  return a;
}

/** The assignments that say exactly what the derived patches show now. */
export function materialiseAssignments(patches: readonly BoardPatch[]): PatchAssignment[] {
  return patches.map((p) => assignmentOf(p, p.number));
}

/**
 * New assignments after a section's outline or seams changed, so that numbers, fabrics and strip sets
 * stay with the patches they belong to: with the same number of patches they follow the derived order;
 * after a split, both halves inherit the fabric of the patch they came from, the first keeps its number
 * and the second takes the next free one.
 */
export function syncAssignments(analysis: SectionAnalysis, before: Section | null, after: Section): PatchAssignment[] {
  let fresh: BoardPatch[];
  try {
    fresh = analysis.derive({ ...after, patches: [] });
  } catch {
    return after.patches;
  }
  if (!before) return materialiseAssignments(fresh);
  let old: BoardPatch[];
  try {
    old = analysis.derive(before);
  } catch {
    return materialiseAssignments(fresh);
  }
  if (old.length === fresh.length) {
    return fresh.map((p, i) => assignmentOf({ ...p, fabricId: old[i].fabricId, stripSet: old[i].stripSet, roughCut: old[i].roughCut, pieceTemplate: old[i].pieceTemplate }, old[i].number));
  }
  const usedNumbers = new Set<number>();
  let next = Math.max(0, ...old.map((p) => p.number)) + 1;
  const out = fresh.map((p) => {
    const parent = old.find((o) => locatePoint(p.labelPoint, o.polygon) !== 'outside');
    let number: number;
    if (parent && !usedNumbers.has(parent.number)) number = parent.number;
    else number = next++;
    usedNumbers.add(number);
    return assignmentOf({ ...p, fabricId: parent?.fabricId, stripSet: parent?.stripSet }, number);
  });
  return renumberCompact(out);
}

/** Renumbers 1…n keeping the relative order of the numbers. */
export function renumberCompact(assignments: readonly PatchAssignment[]): PatchAssignment[] {
  const order = assignments.map((a, i) => ({ a, i })).sort((p, q) => p.a.number - q.a.number);
  const out = assignments.slice();
  order.forEach(({ a, i }, k) => (out[i] = { ...a, number: k + 1 }));
  return out;
}
