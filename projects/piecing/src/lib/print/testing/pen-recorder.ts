import type { jsPDF } from 'jspdf';
import { penHooks, PdfPen } from '../pdf-pen';

/*
 * Benchmark and test tool: records what a render draws through its pen (and the pages it adds), to
 * write the same drawing again with the pen alone — no geometry, layout or text fitting — or with
 * another PDF writer. Used by bench/print.bench.ts.
 */

/** Pen methods that put marks on the page. */
const DRAWING = ['polyline', 'segments', 'rect', 'fillPolygon', 'circle', 'text'] as const;
type DrawingMethod = (typeof DRAWING)[number];

/**
 * One recorded step: a pen call, a page added or chosen, or the start and end of a clipped stretch
 * (clipped to a rectangle, or to a polygon: `ring`, inches, y down).
 */
export type PenCall =
  | { kind: 'draw'; method: DrawingMethod; args: unknown[] }
  | { kind: 'addPage'; widthPt: number; heightPt: number; orientation: 'portrait' | 'landscape' }
  | { kind: 'setPage'; page: number }
  | { kind: 'clip'; rect: { x: number; y: number; width: number; height: number } }
  | { kind: 'clipRing'; ring: ReadonlyArray<{ x: number; y: number }> }
  | { kind: 'unclip' };

/** What a recorded render drew: the first page's size (made with the document) and every step after it. */
export interface PenRecording {
  firstPage: { widthPt: number; heightPt: number };
  calls: PenCall[];
}

/**
 * Records the drawing of every pen made while `run` runs (one render at a time). Drawing still happens:
 * the render's own PDF is written as usual.
 */
export async function recordPenDrawing<T>(run: () => Promise<T>): Promise<{ result: T; recording: PenRecording }> {
  const recording: PenRecording = { firstPage: { widthPt: 0, heightPt: 0 }, calls: [] };
  const calls = recording.calls;
  const previous = penHooks.created;
  penHooks.created = (pen) => {
    const doc = pen.doc;
    const size = doc.internal.pageSize;
    recording.firstPage = { widthPt: size.getWidth(), heightPt: size.getHeight() };
    const target = pen as unknown as Record<string, (...args: unknown[]) => unknown>;
    for (const method of DRAWING) {
      const original = target[method].bind(pen);
      target[method] = (...args: unknown[]) => {
        calls.push({ kind: 'draw', method, args });
        return original(...args);
      };
    }
    const clipped = pen.clipped.bind(pen);
    pen.clipped = (rect, draw) => {
      calls.push({ kind: 'clip', rect });
      clipped(rect, draw);
      calls.push({ kind: 'unclip' });
    };
    const clippedToRing = pen.clippedToRing.bind(pen);
    pen.clippedToRing = (ring, draw) => {
      calls.push({ kind: 'clipRing', ring });
      clippedToRing(ring, draw);
      calls.push({ kind: 'unclip' });
    };
    const addPage = doc.addPage.bind(doc);
    doc.addPage = ((format: [number, number], orientation: 'portrait' | 'landscape') => {
      calls.push({ kind: 'addPage', widthPt: format[0], heightPt: format[1], orientation });
      return addPage(format, orientation);
    }) as jsPDF['addPage'];
    const setPage = doc.setPage.bind(doc);
    doc.setPage = ((page: number) => {
      calls.push({ kind: 'setPage', page });
      return setPage(page);
    }) as jsPDF['setPage'];
  };
  try {
    const result = await run();
    return { result, recording };
  } finally {
    penHooks.created = previous;
  }
}

/** Writes a recording again on a fresh document with the pen alone (fonts already embedded in `doc`). */
export function replayWithPen(doc: jsPDF, recording: PenRecording): void {
  const pen = new PdfPen(doc);
  const target = pen as unknown as Record<string, (...args: unknown[]) => unknown>;
  const calls = recording.calls;
  const run = (from: number): number => {
    for (let i = from; i < calls.length; i++) {
      const call = calls[i];
      switch (call.kind) {
        case 'draw':
          target[call.method](...call.args);
          break;
        case 'addPage':
          doc.addPage([call.widthPt, call.heightPt], call.orientation);
          break;
        case 'setPage':
          doc.setPage(call.page);
          break;
        case 'clip':
        case 'clipRing': {
          // The clipped stretch replays inside the same clip; it ends at its 'unclip'.
          let end = i;
          const inside = () => {
            end = run(i + 1);
          };
          if (call.kind === 'clip') pen.clipped(call.rect, inside);
          else pen.clippedToRing(call.ring, inside);
          i = end;
          break;
        }
        case 'unclip':
          return i;
      }
    }
    return calls.length;
  };
  run(0);
}
