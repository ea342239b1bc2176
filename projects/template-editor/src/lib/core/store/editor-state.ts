import type { PatternDocument } from '@seamwright/piecing';

/** What is selected on the board: a section, and optionally one of its patches (by derived index). */
export interface BoardSelection {
  sectionId: string | null;
  patchIndex: number | null;
}

/** The empty selection. */
export const NO_SELECTION: BoardSelection = Object.freeze({ sectionId: null, patchIndex: null });

/** Why the document changed, as listeners see it. */
export type ChangeOrigin = 'load' | 'command' | 'gesture' | 'undo' | 'redo';

/** A snapshot of the store handed to listeners. */
export interface EditorSnapshot {
  document: PatternDocument;
  selection: BoardSelection;
  origin: ChangeOrigin;
  /** Whether the document differs from the last loaded or saved one. */
  dirty: boolean;
  canUndo: boolean;
  canRedo: boolean;
  /** Id of the section a gesture is changing right now, if any. */
  gestureSectionId: string | null;
}
