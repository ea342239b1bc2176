import { readPatternDocument } from '@seamwright/piecing';
import { describe, expect, it } from 'vitest';
import { SectionAnalysis } from '../analysis/section-analysis';
import { DocumentStore } from '../store/document-store';
import { emptyPattern } from '../testing/board-fixtures';
import { roughCutProblem, setPatchPieceTemplate, setPatchRoughCut, setStripSetSubCutLength } from './cutting-commands';
import { addSeam, addSection, findSection, makeStripSet, setPatchFabric, setPatchStripSet, setPiecingOrder, setSectionGeometry } from './section-commands';

/** A 6 in. square split down x = 2 and across y = 3 on the right: three patches. */
function threePatches() {
  const analysis = new SectionAnalysis();
  const square = { kind: 'straight' as const, vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] };
  const added = addSection(emptyPattern(), square, analysis);
  let doc = addSeam(added.document, added.sectionId, { x: 2, y: 0 }, { x: 2, y: 6 }, analysis);
  doc = addSeam(doc, added.sectionId, { x: 2, y: 3 }, { x: 6, y: 3 }, analysis);
  return { analysis, doc, sectionId: added.sectionId };
}

describe('rough cut and piece template of a patch', () => {
  it('sets a rough cut on one patch only, and clears it back to the computed one', () => {
    const { analysis, doc, sectionId } = threePatches();
    const withCut = setPatchRoughCut(doc, sectionId, 1, { widthIn: 3, lengthIn: 3 }, analysis);
    const patches = analysis.patches(findSection(withCut, sectionId)!);
    expect(patches.map((p) => p.roughCut ?? null)).toEqual([null, { widthIn: 3, lengthIn: 3 }, null]);
    // The document still reads: the assignment is one the format takes.
    expect(readPatternDocument(withCut).sections[0].patches.filter((a) => a.roughCut)).toHaveLength(1);
    const cleared = setPatchRoughCut(withCut, sectionId, 1, undefined, analysis);
    expect(analysis.patches(findSection(cleared, sectionId)!).some((p) => p.roughCut)).toBe(false);
  });

  it('refuses a piece of no size and one larger than the format takes, in words', () => {
    const { analysis, doc, sectionId } = threePatches();
    expect(setPatchRoughCut(doc, sectionId, 0, { widthIn: 0, lengthIn: 3 }, analysis)).toBe(doc);
    expect(setPatchRoughCut(doc, sectionId, 0, { widthIn: 3, lengthIn: 201 }, analysis)).toBe(doc);
    expect(roughCutProblem({ widthIn: 3, lengthIn: 201 })).toBe('a rough-cut piece is at most 200 in. each way');
    expect(roughCutProblem({ widthIn: 2.5, lengthIn: 4 })).toBeNull();
    // Setting what is already there changes nothing, so the store records no step.
    const once = setPatchRoughCut(doc, sectionId, 0, { widthIn: 2.5, lengthIn: 4 }, analysis);
    expect(setPatchRoughCut(once, sectionId, 0, { widthIn: 2.5, lengthIn: 4 }, analysis)).toBe(once);
  });

  it('keeps the rough cut and piece template through a fabric, a strip set, a new piecing order and a moved corner', () => {
    const { analysis, doc: start, sectionId } = threePatches();
    let doc = setPatchRoughCut(start, sectionId, 2, { widthIn: 5, lengthIn: 4.5 }, analysis);
    doc = setPatchPieceTemplate(doc, sectionId, 2, true, analysis);
    doc = setPatchFabric(doc, sectionId, 0, 'plum', analysis);
    doc = setPatchStripSet(doc, sectionId, 1, makeStripSet(doc.fabrics, [1, 1]), analysis);
    doc = setPiecingOrder(doc, sectionId, [2, 1, 0], analysis);
    let p = analysis.patches(findSection(doc, sectionId)!)[2];
    expect([p.number, p.roughCut, p.pieceTemplate]).toEqual([1, { widthIn: 5, lengthIn: 4.5 }, true]);
    // A corner of the left patch moved: same patches, so each keeps what the designer said about it.
    doc = setSectionGeometry(doc, sectionId, { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: -0.5, y: 6 }] }, analysis);
    p = analysis.patches(findSection(doc, sectionId)!)[2];
    expect([p.roughCut, p.pieceTemplate, p.fabricId ?? null]).toEqual([{ widthIn: 5, lengthIn: 4.5 }, true, null]);
    expect(analysis.patches(findSection(doc, sectionId)!)[0].fabricId).toBe('plum');
  });

  it('stores "no piece template asked for" as no value, and each change is one undo step', () => {
    const { analysis, doc, sectionId } = threePatches();
    const store = new DocumentStore(doc);
    store.apply('Piece template', (d) => setPatchPieceTemplate(d, sectionId, 0, true, analysis));
    store.apply('Rough cut', (d) => setPatchRoughCut(d, sectionId, 0, { widthIn: 3, lengthIn: 3 }, analysis));
    expect(store.undoDepth).toBe(2);
    store.apply('Piece template', (d) => setPatchPieceTemplate(d, sectionId, 0, false, analysis));
    const a = findSection(store.document, sectionId)!.patches.find((x) => x.roughCut);
    expect(a && 'pieceTemplate' in a).toBe(false);
    store.undo();
    store.undo();
    expect(analysis.patches(findSection(store.document, sectionId)!)[0]).toMatchObject({ pieceTemplate: true });
    expect(analysis.patches(findSection(store.document, sectionId)!)[0].roughCut).toBeUndefined();
  });
});

describe('sub-cut length of a strip set', () => {
  it('sets the length on every patch the set fills, clears it, and refuses a length of nothing', () => {
    const { analysis, doc: start, sectionId } = threePatches();
    const set = makeStripSet(start.fabrics, [1.25, 1.25, 1.25], 90);
    let doc = setPatchStripSet(start, sectionId, 1, set, analysis);
    doc = setPatchStripSet(doc, sectionId, 2, set, analysis);
    doc = setStripSetSubCutLength(doc, set.id, 3.5);
    expect(findSection(doc, sectionId)!.patches.filter((p) => p.stripSet).map((p) => p.stripSet!.subCutLengthIn)).toEqual([3.5, 3.5]);
    expect(setStripSetSubCutLength(doc, set.id, 0)).toBe(doc);
    expect(setStripSetSubCutLength(doc, set.id, 3.5)).toBe(doc);
    doc = setStripSetSubCutLength(doc, set.id, undefined);
    expect(findSection(doc, sectionId)!.patches.some((p) => p.stripSet && 'subCutLengthIn' in p.stripSet)).toBe(false);
  });
});
