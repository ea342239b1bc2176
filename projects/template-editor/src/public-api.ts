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
 * T strip set, N renumber, D delete, 0 fit; Ctrl+Z undo, Ctrl+Shift+Z / Ctrl+Y redo, Ctrl+C/X/V;
 * arrows nudge the selection by the snap step (Shift: 1 in. or 1 cm), Delete removes it, Escape
 * clears it, ? opens the keyboard help. The Sections outline beside the board selects by keys.
 *
 * Inside `<sw-pattern-editor>` (it shares that editor's session), `<sw-pattern-settings-panel />` edits the
 * whole pattern: sewing numbers, fabrics, strip-set names and resizing, and warns about sections outside
 * the drawing area.
 *
 * `renderFrontViewSvg(document)` returns the true-size front view as SVG text (download, PNG export);
 * list thumbnails are drawn by the server.
 *
 * An explicit list (lint forbids `export *` here): what the app uses and what the usage above names.
 * The framework-free core is '@seamwright/template-editor-core'; the Konva renderer and test fixtures,
 * which only tests and benchmarks need, are in './testing' ('@seamwright/template-editor/testing').
 */

/** The editor component and the panels placed beside or inside it. */
export { PatternEditorComponent } from './lib/pattern-editor/pattern-editor.component';
export { PatternSettingsPanelComponent } from './lib/pattern-settings/pattern-settings-panel.component';
export { TraceImagePanelComponent } from './lib/trace-image/trace-image-panel.component';

/** The editing session a `<sw-pattern-editor>` provides (read it from the component's injector). */
export { EditorSession } from './lib/session/editor-session';
export type { DocumentUpdate, EditorSnapshot } from './lib/core/public-api';

/** Commands and view maths the host page needs: attach an uploaded trace image, screen to document. */
export { setReferenceImage, toDocument } from './lib/core/public-api';

/** The true-size front view of a pattern as SVG text, without a board. */
export { renderFrontViewSvg, type FrontViewSvgOptions } from './lib/core/public-api';
