/*
 * The Drafting board's framework-free core: document store with undo by document diffs, commands,
 * tools as small state machines, snapping, view maths and copy/paste. No Angular, no Konva.
 * Imported inside the library by relative paths and in tests as '@seamwright/template-editor-core'.
 */
export * from './analysis/board-patch';
export * from './analysis/section-analysis';
export * from './history/document-diff';
export * from './history/history';
export * from './store/editor-state';
export * from './store/document-store';
export * from './commands/ids';
export * from './commands/patch-assignments';
export * from './commands/section-handles';
export * from './commands/section-commands';
export * from './commands/seam-commands';
export * from './commands/ring-edges';
export * from './commands/order-commands';
export * from './commands/pattern-commands';
export * from './commands/pattern-settings';
export * from './commands/reference-image';
export * from './clipboard/section-clipboard';
export * from './snapping/snapping';
export * from './snapping/angle-snap';
export * from './tools/tool';
export * from './tools/select.tool';
export * from './tools/straight-section.tool';
export * from './tools/arc-section.tool';
export * from './tools/wedge-section.tool';
export * from './tools/split.tool';
export * from './tools/ring-repeat.tool';
export * from './tools/patch-click.tools';
export * from './tools/renumber.tool';
export * from './tools/pan.tool';
export * from './tools/create-tool';
export * from './view/viewport';
export * from './view/grid-lines';
export * from './editor/board-settings';
export * from './editor/shortcuts';
export * from './editor/board-editor';
export * from './preview/pattern-preview-svg';
export * from './preview/front-view-svg';
