/**
 * Worker thread that renders print sets with the piecing library, off the server's request thread.
 * Receives {@link RenderJob}s, answers progress, the finished PDF (transferred, not copied) or a failure.
 */
import { parentPort } from 'node:worker_threads';
import { readPatternDocument, renderPrintSet } from '@seamwright/piecing';
import type { RenderJob, WorkerMessage } from './print-messages';

const port = parentPort;
if (!port) throw new Error('print-worker must run in a worker thread');
const send = (m: WorkerMessage, transfer: ArrayBuffer[] = []) => port.postMessage(m, transfer);

port.on('message', (job: RenderJob) => {
  void render(job);
});
send({ type: 'ready' });

async function render(job: RenderJob): Promise<void> {
  try {
    const document = readPatternDocument(job.document);
    const result = await renderPrintSet(
      document,
      { ...(job.options as object), fonts: job.fonts },
      (done, total) => send({ type: 'progress', jobId: job.jobId, done, total }),
    );
    const pdf = result.pdf;
    send(
      {
        type: 'done',
        jobId: job.jobId,
        pdf,
        sheetCount: result.sheetCount,
        templateSheetCount: result.templateSheetCount,
        lowerBoundSheets: result.lowerBoundSheets,
      },
      pdf.byteOffset === 0 && pdf.byteLength === pdf.buffer.byteLength ? [pdf.buffer as ArrayBuffer] : [],
    );
  } catch (err) {
    send({ type: 'failed', jobId: job.jobId, message: err instanceof Error ? err.message : String(err) });
  }
}
