import { describe, expect, it } from 'vitest';
import { SectionAnalysis } from '../analysis/section-analysis';
import { DocumentStore } from '../store/document-store';
import { emptyPattern } from '../testing/board-fixtures';
import { seamPressingOf, setSeamPressing } from './pressing-commands';
import { addSeam, addSection, findSection } from './section-commands';

function splitSquare() {
  const analysis = new SectionAnalysis();
  const square = { kind: 'straight' as const, vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] };
  const added = addSection(emptyPattern(), square, analysis);
  const doc = addSeam(added.document, added.sectionId, { x: 2, y: 0 }, { x: 2, y: 4 }, analysis);
  return { doc, sectionId: added.sectionId, seamId: findSection(doc, added.sectionId)!.seams[0].id };
}

describe('pressing of a patch seam', () => {
  it('is toward the patch just added until the designer says otherwise (usual practice on a foundation)', () => {
    const { doc, sectionId, seamId } = splitSquare();
    expect(seamPressingOf(findSection(doc, sectionId)!.seams[0])).toBe('added');
    const open = setSeamPressing(doc, sectionId, seamId, 'open');
    expect(findSection(open, sectionId)!.seams[0].press).toBe('open');
    const previous = setSeamPressing(open, sectionId, seamId, 'previous');
    expect(findSection(previous, sectionId)!.seams[0].press).toBe('previous');
    // Back to the default: the document no longer carries a value.
    const back = setSeamPressing(previous, sectionId, seamId, 'added');
    expect('press' in findSection(back, sectionId)!.seams[0]).toBe(false);
    // The seam's ends are untouched.
    expect(findSection(back, sectionId)!.seams[0]).toEqual(findSection(doc, sectionId)!.seams[0]);
  });

  it('changes nothing for an unknown seam or the pressing it has, and one change is one undo step', () => {
    const { doc, sectionId, seamId } = splitSquare();
    expect(setSeamPressing(doc, sectionId, 'no-such-seam', 'open')).toBe(doc);
    expect(setSeamPressing(doc, sectionId, seamId, 'added')).toBe(doc);
    const store = new DocumentStore(doc);
    store.apply('Seam pressing', (d) => setSeamPressing(d, sectionId, seamId, 'open'));
    store.apply('Seam pressing', (d) => setSeamPressing(d, sectionId, seamId, 'open'));
    expect(store.undoDepth).toBe(1);
    store.undo();
    expect(findSection(store.document, sectionId)!.seams[0].press).toBeUndefined();
  });
});
