import type { PatternDocument } from '@seamwright/piecing';
import { findSection, replaceSection } from './section-commands';

/** Longest pattern notes the format takes. */
export const PATTERN_NOTES_MAX = 4000;
/** Longest section note the format takes. */
export const SECTION_NOTE_MAX = 500;

/**
 * Sets the designer's notes for the quilter, shown on the cover of the print set. Blank notes are
 * stored as none; notes longer than the format takes are refused.
 */
export function setPatternNotes(document: PatternDocument, notes: string): PatternDocument {
  const text = notes.trim();
  if (text.length > PATTERN_NOTES_MAX) return document;
  if ((document.notes ?? '') === text) return document;
  const { notes: _old, ...rest } = document;
  return text ? { ...rest, notes: text } : rest;
}

/** Sets the designer's note on one section (shown on its template); blank is none, too long is refused. */
export function setSectionNote(document: PatternDocument, sectionId: string, note: string): PatternDocument {
  const s = findSection(document, sectionId);
  const text = note.trim();
  if (!s || text.length > SECTION_NOTE_MAX || (s.note ?? '') === text) return document;
  return replaceSection(document, sectionId, (section) => {
    const { note: _old, ...rest } = section;
    return text ? { ...rest, note: text } : rest;
  });
}
