/** Messages between the print-set service and its worker threads. */

export interface RenderJob {
  type: 'render';
  jobId: string;
  /** The stored revision's document (JSON). */
  document: unknown;
  /** Print options (JSON, validated again in the worker by the piecing schema). */
  options: unknown;
  fonts: { regular: Uint8Array; bold: Uint8Array };
}

export type WorkerMessage =
  | { type: 'ready' }
  | { type: 'progress'; jobId: string; done: number; total: number }
  | {
      type: 'done';
      jobId: string;
      pdf: Uint8Array;
      sheetCount: number;
      templateSheetCount: number;
      lowerBoundSheets: number;
    }
  | { type: 'failed'; jobId: string; message: string };
