import type { PatternDocument } from '@seamwright/piecing';
import { renderPatternPreviewSvg } from '@seamwright/template-editor';

/**
 * SVG markup of a pattern preview, from the drafting board's renderer (svg.js); null when drawing
 * fails (a thumbnail is never worth an error).
 */
export function previewSvg(doc: PatternDocument, widthPx = 96): string | null {
  try {
    return renderPatternPreviewSvg(doc, { widthPx });
  } catch {
    return null;
  }
}
