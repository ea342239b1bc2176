import { PRINT_CAUTIONS } from '../cautions';
import type { BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';

/** The designer's notes for the whole pattern (the document's `notes`), trimmed; empty when none. */
export function patternNotes(ctx: Pick<BookletContext, 'document'>): string {
  return ctx.document.notes?.trim() ?? '';
}

/**
 * The designer's notes (the pattern's, then each section's, which also print on the section's
 * piecing page and template sheets), then the cautions (docs/design-notes.md#cautions).
 */
export function drawNotesAndCautions(ctx: BookletContext, writer: BookletWriter): void {
  const flow = writer.part("Designer's notes and cautions");
  flow.heading("Designer's notes");
  const notes = patternNotes(ctx);
  const sectionNotes = ctx.document.sections.filter((s) => s.note?.trim());
  if (!notes && sectionNotes.length === 0) flow.paragraph('The designer left no notes for this pattern.', 9);
  for (const paragraph of notes.split(/\n\s*\n/).filter((p) => p.trim())) flow.paragraph(paragraph.replace(/\s*\n\s*/g, ' '), 9.5);
  for (const section of sectionNotes) flow.paragraph(`Section ${section.label}: ${section.note!.trim()}`, 9.5);
  flow.gap(0.1);
  flow.heading('Cautions');
  for (const caution of PRINT_CAUTIONS) flow.paragraph(`• ${caution}`, 9.5);
}
