import { SVG, registerWindow } from '@svgdotjs/svg.js';
import { polygonBounds, type PatternDocument, type Point } from '@seamwright/piecing';
import { SectionAnalysis } from '../analysis/section-analysis';

/** Options of {@link renderPatternPreviewSvg}. */
export interface PatternPreviewOptions {
  /** Width of the picture in pixels; the height follows the drawing area. */
  widthPx: number;
  /** Whether to write patch labels (A1, A2 …). Default: when patches are large enough to read them. */
  labels?: boolean;
  /** Whether to draw the pattern mirrored, as printed templates are. Default false. */
  mirrored?: boolean;
  /**
   * The window svg.js draws in. In a browser leave it out; in Node pass an svgdom window:
   * `renderPatternPreviewSvg(doc, { widthPx: 320, window: createSVGWindow() })` with
   * `import { createSVGWindow } from 'svgdom'`.
   */
  window?: { document: unknown };
}

const INK = '#34312c';
const EMPTY = '#ffffff';
const PAPER = '#fffdf8';

function pointsAttr(points: readonly Point[]): string {
  return points.map((p) => `${+p.x.toFixed(4)},${+p.y.toFixed(4)}`).join(' ');
}

function escapeText(s: string): string {
  return s.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c] ?? c);
}

/**
 * A static SVG picture of a pattern: the drawing area, every patch filled with its fabric (a strip-set
 * patch with its first strip's), seams and outlines, ring-repeat copies, and patch labels. For
 * pattern-list thumbnails and SVG download. The drawing is in inches (the viewBox), `widthPx` wide.
 */
export function renderPatternPreviewSvg(document: PatternDocument, options: PatternPreviewOptions): string {
  if (!(options.widthPx > 0) || !Number.isFinite(options.widthPx)) throw new RangeError(`widthPx must be a positive number, got ${options.widthPx}`);
  if (options.window) registerWindow(options.window as never, options.window.document as never);
  const { widthIn, heightIn } = document.canvas;
  const widthPx = Math.round(options.widthPx);
  const heightPx = Math.max(1, Math.round((options.widthPx * heightIn) / widthIn));
  const pxPerIn = widthPx / widthIn;
  const analysis = new SectionAnalysis();
  const colours = new Map(document.fabrics.map((f) => [f.id, f.colour]));

  const draw = SVG().size(widthPx, heightPx).viewbox(0, 0, widthIn, heightIn);
  draw.attr({ role: 'img', 'aria-label': `${document.title}: ${document.sections.length} sections` });
  draw.element('title').words(document.title);
  draw.rect(widthIn, heightIn).fill(PAPER);
  const content = draw.group();
  if (options.mirrored) content.transform({ a: -1, b: 0, c: 0, d: 1, e: widthIn, f: 0 });
  const strokeIn = Math.max(0.5, Math.min(1.5, pxPerIn / 30)) / pxPerIn;
  const labels: Array<{ text: string; at: Point; sizeIn: number }> = [];

  for (const section of document.sections) {
    analysis.placements(section).forEach((placement, copy) => {
      const g = content.group().attr({ 'data-section': section.label });
      const patches = analysis.patches(placement);
      for (const p of patches) {
        const fill = (p.stripSet ? colours.get(p.stripSet.strips[0]?.fabricId ?? '') : p.fabricId ? colours.get(p.fabricId) : undefined) ?? EMPTY;
        g.polygon(pointsAttr(p.polygon)).fill(fill).stroke({ color: INK, width: strokeIn * 0.6, linejoin: 'round' });
        if (p.stripBands) {
          const clip = draw.clip();
          clip.polygon(pointsAttr(p.polygon));
          const bands = g.group().clipWith(clip);
          for (const band of p.stripBands) bands.polygon(pointsAttr(band.polygon)).fill(colours.get(band.fabricId) ?? EMPTY);
        }
        if (copy === 0) {
          const b = polygonBounds(p.polygon);
          labels.push({ text: p.label, at: p.labelPoint, sizeIn: Math.min(b.maxX - b.minX, b.maxY - b.minY) });
        }
      }
      const outline = analysis.outline(placement);
      if (outline.length > 2) g.polygon(pointsAttr(outline)).fill('none').stroke({ color: INK, width: strokeIn * 1.4, linejoin: 'round' });
    });
  }

  const fontIn = 10 / pxPerIn;
  const showLabels = options.labels ?? true;
  if (showLabels) {
    const layer = draw.group().attr({ 'font-family': 'Roboto, sans-serif', 'font-size': +fontIn.toFixed(4), 'text-anchor': 'middle', fill: INK });
    for (const l of labels) {
      if (options.labels === undefined && l.sizeIn < fontIn * 2.4) continue;
      const x = options.mirrored ? widthIn - l.at.x : l.at.x;
      layer.plain(l.text).attr({ x: +x.toFixed(4), y: +(l.at.y + fontIn * 0.35).toFixed(4) });
    }
  }
  // svg.js sets xmlns as a plain attribute; svgdom's XML writer wants it in the xmlns namespace.
  const root = draw.node as unknown as Element;
  root.removeAttribute('xmlns');
  root.setAttributeNS('http://www.w3.org/2000/xmlns/', 'xmlns', 'http://www.w3.org/2000/svg');
  const svg = draw.svg();
  draw.remove();
  // svg.js writes its own helper attributes; keep the file plain.
  return svg.replace(/ xmlns:svgjs="[^"]*"/g, '').replace(/ svgjs:data="[^"]*"/g, '') || `<svg xmlns="http://www.w3.org/2000/svg"><title>${escapeText(document.title)}</title></svg>`;
}
