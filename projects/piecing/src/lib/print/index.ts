/*
 * Print sets: true-scale, tiled, packed and mirrored template sheets written as PDF with jsPDF,
 * in Node and in the browser. The fonts are passed in (see PrintFonts); nothing here reads files.
 */
export * from './paper';
export * from './print-options';
export * from './template-model';
export * from './layout-types';
export * from './sheet-frame';
export { PRINT_AT_ACTUAL_SIZE } from './draw-sheet-frame';
export { PRINT_CAUTIONS } from './cautions';
export { sheetCountStatement } from './draw-cover';
export { buildPrintTemplates } from './print-templates';
export { layoutTemplates } from './plan-print-layout';
export { planPrintLayout, renderPrintSet, type PrintSetResult, type PrintProgress, type RenderPrintSetOptions } from './render-print-set';
export { findUnsewableSections, unsewableStatement, UnsewablePatternError, type UnsewableSection } from './booklet/unsewable-sections';
export { finishedBlockSize, type FinishedBlockSize } from './booklet/finished-size';
export { buildPieceTemplates, type PieceTemplate } from './piece-templates/build-piece-templates';
export { quiltPrintDocument, quiltPrintIssues, assemblySteps } from './booklet/quilt-booklet';
