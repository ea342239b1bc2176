import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs';

/*
 * Test-only reader of produced PDFs, through pdfjs-dist (Mozilla's PDF reader), never through our
 * own writer. Walks each page's operator list and collects the stroked and clipping paths with the
 * line width and dash pattern in force. Coordinates are PDF user space (points, y up).
 */

// Sub-path commands inside a constructPath operator, as pdfjs-dist 5.x encodes them (DrawOPS in
// its src/shared/util.js; not exported by the package).
const MOVE_TO = 0;
const LINE_TO = 1;
const CURVE_TO = 2;
const QUAD_TO = 3;
const CLOSE = 4;

export interface PdfPoint {
  x: number;
  y: number;
}

/** One sub-path of a painted path. */
export interface PdfSubpath {
  points: PdfPoint[];
  closed: boolean;
  /** Whether it has curve segments (circles); their control points are not in `points`. */
  curved: boolean;
}

export interface PdfPath {
  kind: 'stroke' | 'fill' | 'clip' | 'other';
  lineWidth: number;
  dash: number[];
  subpaths: PdfSubpath[];
  /** Clip rectangles in force (outermost first) when the path was painted. */
  clips: PdfSubpath[];
}

export interface PdfPageInfo {
  width: number;
  height: number;
  paths: PdfPath[];
  text: string[];
  fontIds: string[];
}

export interface PdfFontInfo {
  name: string;
  type: string;
  missingFile: boolean;
  isType3Font: boolean;
  dataLength: number;
}

/** Reads every page of a PDF. */
export async function inspectPdf(bytes: Uint8Array): Promise<{ pages: PdfPageInfo[]; fonts: PdfFontInfo[] }> {
  const pdf = await pdfjs.getDocument({ data: bytes.slice(), fontExtraProperties: true, verbosity: 0 }).promise;
  const pages: PdfPageInfo[] = [];
  const fonts = new Map<string, PdfFontInfo>();
  for (let n = 1; n <= pdf.numPages; n++) {
    const page = await pdf.getPage(n);
    const [x0, y0, x1, y1] = page.view;
    const ops = await page.getOperatorList();
    const paths: PdfPath[] = [];
    const fontIds: string[] = [];
    let lineWidth = 1;
    let dash: number[] = [];
    let clips: PdfSubpath[] = [];
    let pendingClip = false;
    const stack: Array<{ lineWidth: number; dash: number[]; clips: PdfSubpath[] }> = [];
    ops.fnArray.forEach((fn, i) => {
      const args = ops.argsArray[i];
      switch (fn) {
        case pdfjs.OPS.save:
          stack.push({ lineWidth, dash, clips });
          break;
        case pdfjs.OPS.restore: {
          const s = stack.pop();
          if (s) ({ lineWidth, dash, clips } = s);
          break;
        }
        case pdfjs.OPS.setLineWidth:
          lineWidth = args[0];
          break;
        case pdfjs.OPS.setDash:
          dash = [...args[0]];
          break;
        case pdfjs.OPS.clip:
        case pdfjs.OPS.eoClip:
          pendingClip = true;
          break;
        case pdfjs.OPS.setFont:
          fontIds.push(args[0]);
          break;
        case pdfjs.OPS.constructPath: {
          const paintOp = args[0];
          const data: ArrayLike<number> = args[1][0] ?? [];
          const subpaths = decodePath(data);
          const kind =
            pendingClip ? 'clip'
            : paintOp === pdfjs.OPS.stroke || paintOp === pdfjs.OPS.closeStroke ? 'stroke'
            : paintOp === pdfjs.OPS.fill || paintOp === pdfjs.OPS.eoFill ? 'fill'
            : 'other';
          paths.push({ kind, lineWidth, dash, subpaths, clips });
          if (pendingClip) {
            clips = [...clips, ...subpaths];
            pendingClip = false;
          }
          break;
        }
      }
    });
    const text = (await page.getTextContent()).items.map((t) => ('str' in t ? t.str : ''));
    for (const id of new Set(fontIds)) {
      const f = page.commonObjs.get(id) as { name: string; type: string; missingFile: boolean; isType3Font: boolean; data?: Uint8Array };
      fonts.set(id, { name: f.name, type: f.type, missingFile: f.missingFile, isType3Font: f.isType3Font, dataLength: f.data?.length ?? 0 });
    }
    pages.push({ width: x1 - x0, height: y1 - y0, paths, text, fontIds });
  }
  await pdf.destroy();
  return { pages, fonts: [...fonts.values()] };
}

function decodePath(data: ArrayLike<number>): PdfSubpath[] {
  const out: PdfSubpath[] = [];
  let cur: PdfSubpath | null = null;
  for (let i = 0; i < data.length; ) {
    const op = data[i++];
    if (op === MOVE_TO) {
      cur = { points: [{ x: data[i], y: data[i + 1] }], closed: false, curved: false };
      out.push(cur);
      i += 2;
    } else if (op === LINE_TO) {
      cur?.points.push({ x: data[i], y: data[i + 1] });
      i += 2;
    } else if (op === CURVE_TO) {
      if (cur) cur.curved = true;
      cur?.points.push({ x: data[i + 4], y: data[i + 5] });
      i += 6;
    } else if (op === QUAD_TO) {
      if (cur) cur.curved = true;
      cur?.points.push({ x: data[i + 2], y: data[i + 3] });
      i += 4;
    } else if (op === CLOSE) {
      if (cur) cur.closed = true;
    } else {
      throw new Error(`unknown path command ${op}`);
    }
  }
  return out;
}

/** Side lengths of a closed four-corner axis-aligned sub-path (a rectangle), or null. */
export function rectangleSides(s: PdfSubpath): { width: number; height: number; x: number; y: number } | null {
  const pts = s.points.length === 5 && near(s.points[0], s.points[4]) ? s.points.slice(0, 4) : s.points;
  if (pts.length !== 4 || s.curved) return null;
  const xs = pts.map((p) => p.x);
  const ys = pts.map((p) => p.y);
  const axisAligned = pts.every((p, i) => {
    const q = pts[(i + 1) % 4];
    return Math.abs(p.x - q.x) < 1e-6 || Math.abs(p.y - q.y) < 1e-6;
  });
  if (!axisAligned) return null;
  return { x: Math.min(...xs), y: Math.min(...ys), width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) };
}

function near(a: PdfPoint, b: PdfPoint): boolean {
  return Math.abs(a.x - b.x) < 1e-6 && Math.abs(a.y - b.y) < 1e-6;
}

/** Signed shoelace area of a sub-path (positive counter-clockwise in PDF's y-up space). */
export function signedAreaPt(points: readonly PdfPoint[]): number {
  let twice = 0;
  for (let i = 0; i < points.length; i++) {
    const a = points[i];
    const b = points[(i + 1) % points.length];
    twice += a.x * b.y - b.x * a.y;
  }
  return twice / 2;
}

/** A text item as pdfjs-dist reads it: the string, where it starts (PDF points, y up) and its width in points. */
export interface PdfTextItem {
  str: string;
  x: number;
  y: number;
  width: number;
}

/** The text items of every page (pdfjs-dist's text content only, quicker than {@link inspectPdf}). */
export async function pdfPageTexts(bytes: Uint8Array): Promise<PdfTextItem[][]> {
  const pdf = await pdfjs.getDocument({ data: bytes.slice(), verbosity: 0 }).promise;
  const pages: PdfTextItem[][] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const page = await pdf.getPage(n);
    const items = (await page.getTextContent()).items;
    pages.push(items.flatMap((t) => ('str' in t && t.str !== '' ? [{ str: t.str, x: t.transform[4], y: t.transform[5], width: t.width }] : [])));
  }
  await pdf.destroy();
  return pages;
}
