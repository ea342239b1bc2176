/*
 * Test and benchmark entry of @seamwright/template-editor ('@seamwright/template-editor/testing'):
 * the board's Konva renderer, driven without Angular by the frame-time benchmark, and the core's
 * fixtures for scripting the editor (an empty pattern, an editor at 100 px per inch, pointer steps).
 * Importing it loads Konva. Not for product code.
 */
export { BoardRenderer } from './lib/board/konva/board-renderer';
export {
  emptyPattern,
  testEditor,
  play,
  click,
  polar,
  type PointerStep,
} from './lib/core/testing/board-fixtures';
