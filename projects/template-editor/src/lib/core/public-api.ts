/*
 * The Drafting board's framework-free core: document store with undo by document diffs, commands,
 * tools as small state machines, snapping, view maths and copy/paste. No Angular, no Konva (lint
 * enforces it). The library's components and Konva drawing import the core only through this file
 * ('../core/public-api'); tests and benchmarks outside the library as '@seamwright/template-editor-core'.
 * An explicit list of what they use: to use another core name outside the core, add it to its group.
 */

/** The editor behind the board: pointer input, tools, view, selection, analysis, document store. */
export { BoardEditor } from './editor/board-editor';
export type { BoardSettings } from './editor/board-settings';
export type { EditorSnapshot } from './store/editor-state';
export type { DocumentUpdate } from './store/document-store';
export { diffValues } from './history/document-diff';
export type { BoardSelection } from './store/editor-state';

/** The board by keys: nudging the selection, and what the live region and the Sections outline say. */
export { nudgeStepIn, NUDGE_DIRECTIONS } from './commands/nudge-commands';
export { describeSection, selectionMessage, spokenLength } from './editor/board-announcements';
export { TOOL_SHORTCUTS } from './editor/shortcuts';

/** What the board shows of each section: patches, sewability, the order search. */
export { SectionAnalysis } from './analysis/section-analysis';
export type { BoardPatch, BoardSewability, BoardOrderSearch } from './analysis/board-patch';
export { OrderSearchRunner, type OrderSearchWorker } from './analysis/order-search-runner';

/** Commands on sections, seams and patches: each takes a document and returns the changed one. */
export {
  findSection,
  addSection,
  addSeam,
  setSectionGeometry,
  setRingRepeat,
  updateSectionDetails,
  setPatchFabric,
  setPatchStripSet,
  makeStripSet,
  setPiecingOrder,
} from './commands/section-commands';
export { setSeamEnd } from './commands/seam-commands';
export { sectionHandles } from './commands/section-handles';
export { applySewableOrder, applyFoundOrder } from './commands/order-commands';

/** Pressing of patch seams, cutting the way designers write it, and the designer's notes. */
export { setSeamPressing, seamPressingOf, DEFAULT_SEAM_PRESSING } from './commands/pressing-commands';
export { setPatchRoughCut, setPatchPieceTemplate, setStripSetSubCutLength, roughCutProblem, type RoughCutPiece } from './commands/cutting-commands';
export { setPatternNotes, setSectionNote, PATTERN_NOTES_MAX, SECTION_NOTE_MAX } from './commands/notes-commands';

/** The designer's joining plan: take the proposal, move a join, set its pressing, go back to the proposal. */
export {
  currentJoiningPlan,
  adoptDefaultJoiningPlan,
  resetJoiningPlan,
  joiningStepMoveProblem,
  moveJoiningStep,
  setJoiningStepPress,
  type RingPress,
  type JoinPress,
} from './commands/joining-plan-commands';

/** Commands on the whole pattern: sewing numbers, fabrics, strip-set names, resizing. */
export { setPatternSettings } from './commands/pattern-commands';
export {
  isFabricColour,
  newFabric,
  addFabric,
  fabricChangeProblem,
  updateFabric,
  fabricUses,
  removeFabric,
  setSewingSettings,
  SEWING_SETTING_RANGES,
  patternStripSets,
  renameStripSet,
  resizeDesign,
  type FabricChange,
  type SewingSettingsChange,
} from './commands/pattern-settings';

/** The traced reference image: set, place, move, fade, scale by two points, remove. */
export {
  setReferenceImage,
  placeReferenceImage,
  moveReferenceImage,
  setReferenceOpacity,
  removeReferenceImage,
} from './commands/reference-image';
export { ReferenceScaleTool } from './tools/reference-scale.tool';

/** Tools whose typed values the properties panel edits, and what every tool shares. */
export type { ToolId, ToolPreview } from './tools/tool';
export { ArcSectionTool } from './tools/arc-section.tool';
export { WedgeSectionTool } from './tools/wedge-section.tool';
export type { GridSnap } from './snapping/snapping';

/** View maths: document inches to screen pixels and back, grid lines. */
export { toScreen, toDocument, type Viewport } from './view/viewport';
export { gridLines, type BoardUnit } from './view/grid-lines';
export type { BoardHighlight } from './view/board-highlight';

/** The true-size front view of a pattern as SVG text. */
export { renderFrontViewSvg, type FrontViewSvgOptions } from './preview/front-view-svg';
export { renderFourBlockSvg } from './preview/four-block-svg';
