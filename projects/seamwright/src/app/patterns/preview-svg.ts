import type { PatternDocument } from '@seamwright/piecing';

/**
 * SVG markup of a pattern preview, from the drafting board's renderer; null until it is available
 * or when drawing fails (a thumbnail is never worth an error).
 */
export function previewSvg(doc: PatternDocument): string | null {
  void doc;
  return null;
}
