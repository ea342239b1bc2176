/*
 * Public API of @seamwright/template-editor: the Drafting board.
 *
 * Usage in the app (one component does it all):
 *
 *   <sw-pattern-editor
 *     [document]="doc"                  // PatternDocument to open; a new object loads it (not undoable)
 *     [readOnly]="!canEdit"             // quilters: look, zoom, pan, select; no changes
 *     [referenceImageUrl]="imageUrl"    // traced image, drawn locked and faded under the drawing
 *     (documentChange)="onChange($event)" // after every change (a drag emits once, at its end)
 *     (dirtyChange)="dirty = $event" />   // changes since the last load or markSaved()
 *
 *   @ViewChild(PatternEditorComponent) editor!: PatternEditorComponent;
 *   ... after a successful save:  editor.markSaved();
 *   ... after a 409, to take the server's revision: set [document] to it (history is cleared).
 *
 * Keys on the board: V select, H pan, S straight, A arc, W wedge, L split, R ring repeat, F fill,
 * T strip set, N renumber, D delete, 0 fit; Ctrl+Z undo, Ctrl+Shift+Z / Ctrl+Y redo, Ctrl+C/X/V.
 *
 * Inside `<sw-pattern-editor>` (it shares that editor's session), `<sw-pattern-settings-panel />` edits the
 * whole pattern: sewing numbers, fabrics, strip-set names and resizing, and warns about sections outside
 * the drawing area.
 *
 * `renderPatternPreviewSvg(document, { widthPx })` returns an SVG string of the pattern (thumbnails,
 * SVG download); in Node pass an svgdom window (see pattern-preview-svg.ts).
 */
export * from './lib/pattern-editor/pattern-editor.component';
export * from './lib/board/drafting-board.component';
export * from './lib/session/editor-session';
export * from './lib/toolbar/board-toolbar.component';
export * from './lib/properties/properties-panel.component';
export * from './lib/properties/number-field.component';
export * from './lib/trace-image/trace-image-panel.component';
export * from './lib/pattern-settings/pattern-settings-panel.component';
export * from './lib/piecing-order/piecing-order.component';
export * from './lib/status/board-status.component';
export * from './lib/status/cursor-readout';
export * from './lib/core/public-api';
