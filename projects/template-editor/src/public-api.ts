/*
 * Public API of @seamwright/template-editor: the Drafting board.
 */
export * from './lib/board/drafting-board.component';
