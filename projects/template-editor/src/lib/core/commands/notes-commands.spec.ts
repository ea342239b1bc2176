import { describe, expect, it } from 'vitest';
import { SectionAnalysis } from '../analysis/section-analysis';
import { emptyPattern } from '../testing/board-fixtures';
import { setPatternNotes, setSectionNote } from './notes-commands';
import { addSection, findSection } from './section-commands';

describe("the designer's notes", () => {
  it('sets pattern notes, keeps blank as none and refuses more than the format takes', () => {
    const doc = emptyPattern();
    const noted = setPatternNotes(doc, '  Press the ring seams all one way round.  ');
    expect(noted.notes).toBe('Press the ring seams all one way round.');
    expect(setPatternNotes(noted, 'Press the ring seams all one way round.')).toBe(noted);
    expect('notes' in setPatternNotes(noted, '   ')).toBe(false);
    expect(setPatternNotes(doc, 'x'.repeat(4001))).toBe(doc);
    expect(setPatternNotes(doc, 'x'.repeat(4000)).notes).toHaveLength(4000);
  });

  it("sets a section's note and clears it", () => {
    const analysis = new SectionAnalysis();
    const added = addSection(emptyPattern(), { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 2, y: 0 }, { x: 2, y: 2 }] }, analysis);
    const noted = setSectionNote(added.document, added.sectionId, 'Centre the stripe on the guide line.');
    expect(findSection(noted, added.sectionId)!.note).toBe('Centre the stripe on the guide line.');
    expect(setSectionNote(noted, added.sectionId, 'y'.repeat(501))).toBe(noted);
    expect('note' in findSection(setSectionNote(noted, added.sectionId, ''), added.sectionId)!).toBe(false);
  });
});
