import type { PatternDocument } from '@seamwright/piecing';
import type { BoardOrderSearch } from '../analysis/board-patch';
import type { SectionAnalysis } from '../analysis/section-analysis';
import { applyOrderByNumbers, findSection } from './section-commands';

/**
 * Looks for a sewable order of a section and applies it when there is one. Without one the document
 * stays as it is and the result carries the reason and, when the search found it, a suggested split.
 */
export function applySewableOrder(document: PatternDocument, sectionId: string, analysis: SectionAnalysis): { document: PatternDocument; result: BoardOrderSearch } {
  const section = findSection(document, sectionId);
  if (!section) return { document, result: { ok: false, reason: 'no such section' } };
  const result = analysis.findOrder(section);
  return { document: applyFoundOrder(document, sectionId, result, analysis), result };
}

/**
 * Applies the answer of an order search made elsewhere (the board's worker): the order when one was
 * found, else the document as it is.
 */
export function applyFoundOrder(document: PatternDocument, sectionId: string, result: BoardOrderSearch, analysis: SectionAnalysis): PatternDocument {
  return result.ok && findSection(document, sectionId) ? applyOrderByNumbers(document, sectionId, result.order, analysis) : document;
}
