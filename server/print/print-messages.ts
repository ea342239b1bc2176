/** What the print-set service sends its pool's worker threads, and what they answer. */
import type { MessagePort } from 'node:worker_threads';

/** One print set to render (a piscina task). */
export interface RenderTask {
  jobId: string;
  /** The stored revision's document (JSON). */
  document: unknown;
  /** Print options (JSON, validated again in the worker by the piecing schema). */
  options: unknown;
  /** Roboto, and the fallback fonts for characters it lacks (fonts/README.md). */
  fonts: { regular: Uint8Array; bold: Uint8Array; fallbacks: Uint8Array[] };
  /** Progress goes back through this port (transferred with the task). */
  progress: MessagePort;
  /**
   * One Int32 the service sets to 1 when the set is deleted: the render checks it between sheets
   * and stops there, so its worker is free for the next set without being restarted.
   */
  cancel: SharedArrayBuffer;
  /** Most template sheets a set may have; the render stops once its layout says more. */
  maxSheets: number;
}

/** A progress report: `done` of `total` steps (booklet, each template sheet, closing). */
export interface RenderProgress {
  done: number;
  total: number;
}

/** A finished render (the task's result). */
export interface RenderResult {
  pdf: Uint8Array;
  sheetCount: number;
  templateSheetCount: number;
  lowerBoundSheets: number;
}

/** The message of the error a render throws when it sees its cancel flag. */
export const RENDER_CANCELLED = 'The print set was deleted while it rendered';
