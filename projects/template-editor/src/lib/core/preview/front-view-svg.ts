import {
  derivePatches,
  expandRingRepeat,
  flattenSectionOutline,
  locatePoint,
  polygonBounds,
  type PatternDocument,
  type Point,
  type Section,
} from '@seamwright/piecing';
import { toBoardPatch, type BoardPatch } from '../analysis/board-patch';

/** Options of {@link renderFrontViewSvg}. */
export interface FrontViewSvgOptions {
  /** Whether to write patch labels (A1, A2 …). Default true. */
  labels?: boolean;
}

const INK = '#34312c';
const LIGHT_INK = '#fffdf8';
const EMPTY = '#ffffff';
const PAPER = '#fffdf8';
/** Line widths in inches: seams hairline-thin, section outlines twice as heavy. */
const SEAM_IN = 0.015;
const OUTLINE_IN = 0.035;
/** Label text height in inches, largest and smallest. */
const LABEL_MAX_IN = 0.3;
const LABEL_MIN_IN = 0.08;

const num = (v: number) => String(+v.toFixed(4));

function escapeXml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c] ?? c);
}

function pathData(ring: readonly Point[]): string {
  return `M${ring.map((p) => `${num(p.x)} ${num(p.y)}`).join('L')}Z`;
}

function pointsAttr(ring: readonly Point[]): string {
  return ring.map((p) => `${num(p.x)},${num(p.y)}`).join(' ');
}

/** Dark ink on light fabric, light ink on dark fabric (relative luminance of sRGB, WCAG 2 definition). */
function inkOn(fill: string): string {
  const channel = (hex: string) => {
    const c = parseInt(hex, 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  const l = 0.2126 * channel(fill.slice(1, 3)) + 0.7152 * channel(fill.slice(3, 5)) + 0.0722 * channel(fill.slice(5, 7));
  return l < 0.18 ? LIGHT_INK : INK;
}

function patchesOf(section: Section): BoardPatch[] {
  try {
    return derivePatches(section).patches.map(toBoardPatch);
  } catch {
    return [];
  }
}

function outlineOf(section: Section): Point[] {
  try {
    return flattenSectionOutline(section.geometry);
  } catch {
    return [];
  }
}

/**
 * The front view of a pattern as a stand-alone SVG file at true size: `width` and `height` in inches
 * (the drawing area), a viewBox in inches, every patch one `<path data-patch="A1">` filled with its
 * fabric (strip-set patches with their strips, clipped to the patch), ring-repeat copies, section
 * outlines, and patch labels at each patch's label point. Seen from the front, as the finished block is (see docs/pattern-format.md).
 * Plain string output: works the same in a browser and in Node.
 */
export function renderFrontViewSvg(document: PatternDocument, options: FrontViewSvgOptions = {}): string {
  const { widthIn, heightIn } = document.canvas;
  const colours = new Map(document.fabrics.map((f) => [f.id, f.colour]));
  const defs: string[] = [];
  const body: string[] = [];
  const labels: string[] = [];
  let patchCount = 0;

  for (const section of document.sections) {
    const placements = section.ringRepeat ? expandRingRepeat(section) : [section];
    placements.forEach((placement, copy) => {
      const group: string[] = [];
      for (const patch of patchesOf(placement)) {
        patchCount++;
        const id = `patch-${placement.id}-${patch.number}`;
        const d = pathData(patch.polygon);
        const bands = patch.stripBands ?? [];
        const attrs = `id="${id}" data-patch="${escapeXml(patch.label)}" d="${d}" stroke="${INK}" stroke-width="${SEAM_IN}" stroke-linejoin="round"`;
        let fill = EMPTY;
        if (bands.length) {
          defs.push(`<clipPath id="clip-${id}"><use href="#${id}"/></clipPath>`);
          group.push(
            `<g clip-path="url(#clip-${id})">${bands.map((band) => `<polygon points="${pointsAttr(band.polygon)}" fill="${colours.get(band.fabricId) ?? EMPTY}"/>`).join('')}</g>`,
          );
          group.push(`<path ${attrs} fill="none"/>`);
        } else {
          fill = (patch.fabricId && colours.get(patch.fabricId)) || EMPTY;
          group.push(`<path ${attrs} fill="${fill}"/>`);
        }
        if (copy === 0 && options.labels !== false) {
          const b = polygonBounds(patch.polygon);
          const sizeIn = Math.max(LABEL_MIN_IN, Math.min(LABEL_MAX_IN, 0.3 * Math.min(b.maxX - b.minX, b.maxY - b.minY)));
          const at = patch.labelPoint;
          // On a strip set the label sits on one strip: its ink must read on that strip's fabric.
          const under = bands.find((band) => locatePoint(at, band.polygon) !== 'outside');
          if (under) fill = colours.get(under.fabricId) ?? EMPTY;
          labels.push(
            `<text x="${num(at.x)}" y="${num(at.y + sizeIn * 0.35)}" font-size="${num(sizeIn)}" fill="${inkOn(fill)}">${escapeXml(patch.label)}</text>`,
          );
        }
      }
      const outline = outlineOf(placement);
      if (outline.length > 2) {
        group.push(`<polygon points="${pointsAttr(outline)}" fill="none" stroke="${INK}" stroke-width="${OUTLINE_IN}" stroke-linejoin="round"/>`);
      }
      body.push(`<g data-section="${escapeXml(section.label)}" data-copy="${copy + 1}">${group.join('')}</g>`);
    });
  }

  const title = escapeXml(document.title);
  const description = `Front view, ${num(widthIn)} × ${num(heightIn)} in., ${document.sections.length} sections, ${patchCount} patches`;
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" width="${num(widthIn)}in" height="${num(heightIn)}in" viewBox="0 0 ${num(widthIn)} ${num(heightIn)}" role="img" aria-label="${title}">`,
    `<title>${title}</title>`,
    `<desc>${description}</desc>`,
    defs.length ? `<defs>${defs.join('')}</defs>` : '',
    `<rect width="${num(widthIn)}" height="${num(heightIn)}" fill="${PAPER}"/>`,
    ...body,
    labels.length ? `<g font-family="Roboto, Arial, sans-serif" text-anchor="middle">${labels.join('')}</g>` : '',
    '</svg>',
  ]
    .filter((line) => line !== '')
    .join('\n')
    .concat('\n');
}
