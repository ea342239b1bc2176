/**
 * The print pool's task (a piscina worker thread): renders one print set with the piecing library, off
 * the server's request thread. Progress goes back through the task's port; between sheets the render
 * looks at the task's cancel flag and stops when the set was deleted, and stops when its layout has
 * more template sheets than the budget allows.
 */
import { applyFabricChoice, readPatternDocument, renderPrintSet, type FabricChoiceSlot } from '@seamwright/piecing';
import { RENDER_CANCELLED, type RenderResult, type RenderTask } from './print-messages';

/** Steps of a render besides its template sheets (booklet, closing, …): see renderPrintSet's progress. */
const NON_SHEET_STEPS = 3;

export default async function renderTask(task: RenderTask): Promise<RenderResult> {
  const cancelled = new Int32Array(task.cancel);
  try {
    // A quilter's colourway copy is stored with the set's options (server/routes/print-sets.ts) as a
    // snapshot of its fabrics; the render takes the document in those fabrics and the rest as options.
    const { colourwayCopy, ...options } = task.options as { colourwayCopy?: { fabrics: Record<string, FabricChoiceSlot> } };
    const read = readPatternDocument(task.document);
    const document = colourwayCopy ? applyFabricChoice(read, colourwayCopy.fabrics) : read;
    const result = await renderPrintSet(document, { ...options, fonts: task.fonts }, (done, total) => {
      if (Atomics.load(cancelled, 0) !== 0) throw new Error(RENDER_CANCELLED);
      // The total counts template sheets from the second step on, once the layout is made.
      if (total - NON_SHEET_STEPS > task.maxSheets) {
        throw new Error(`The templates take ${total - NON_SHEET_STEPS} sheets, more than the ${task.maxSheets} a print set may have`);
      }
      task.progress.postMessage({ done, total });
    });
    return {
      pdf: result.pdf,
      sheetCount: result.sheetCount,
      templateSheetCount: result.templateSheetCount,
      lowerBoundSheets: result.lowerBoundSheets,
    };
  } finally {
    task.progress.close();
  }
}
