import type { Point, SectionGeometry } from '@seamwright/piecing';
import type { SectionAnalysis } from '../analysis/section-analysis';
import type { SnapResult } from '../snapping/snapping';
import type { DocumentStore } from '../store/document-store';

/** The tools of the Drafting board. */
export type ToolId = 'select' | 'straight' | 'arc' | 'wedge' | 'split' | 'ring' | 'fill' | 'strip-set' | 'renumber' | 'delete' | 'pan';

/** A pointer event in document inches (the board converts from screen pixels). */
export interface ToolPointer {
  point: Point;
  shiftKey?: boolean;
  altKey?: boolean;
}

/** What a tool draws while it works (rubber band, half-made section, seam being drawn). */
export type ToolPreview =
  | { kind: 'polyline'; points: Point[]; closed: boolean }
  | { kind: 'geometry'; geometry: SectionGeometry }
  | { kind: 'seam'; a: Point; b: Point; valid: boolean }
  | { kind: 'marker'; point: Point; label: string };

/** What tools may use: the store, the section analysis, snapping and the board's settings. */
export interface ToolContext {
  readonly store: DocumentStore;
  readonly analysis: SectionAnalysis;
  /** Snaps a raw pointer position (grid, points; edges when asked). */
  snap(p: Point, options?: { edges?: boolean; excludeSectionId?: string }): SnapResult;
  /**
   * Snaps a direction or a sweep (degrees) about `centre` when angle snapping is on: to the divisions
   * of the ring repeats around that centre and the ring tool's count, else to 7.5° steps.
   */
  snapAngle(angleDeg: number, centre: Point, kind: 'direction' | 'sweep'): number;
  /** Whether snapping to points is on (corners then also follow the rings they sit on). */
  snapsToPoints(): boolean;
  /** Rounds to the grid step alone (for moves of whole sections). */
  snapGrid(p: Point): Point;
  /** Hit radius in inches at the current zoom (a few screen pixels). */
  hitRadiusIn(): number;
  /** The fabric the fill tool paints with. */
  activeFabricId(): string | null;
  /** Finished strip widths the strip-set tool uses, in inches. */
  stripWidthsIn(): number[];
  /** Copies a ring repeat gets when the ring tool sets one. */
  ringCount(): number;
}

/** A tool: a small state machine driven by pointer and key events. */
export interface BoardTool {
  readonly id: ToolId;
  /** The current state's name (idle, pointing, dragging …), for tests and the status line. */
  readonly state: string;
  /** A short hint of what to do next, in words. */
  readonly hint: string;
  pointerDown(e: ToolPointer): void;
  pointerMove(e: ToolPointer): void;
  pointerUp(e: ToolPointer): void;
  /** Handles a key; returns whether the tool used it. */
  key(key: string): boolean;
  /** Drops whatever is half done. */
  cancel(): void;
  /** What to draw for the tool right now. */
  preview(): ToolPreview | null;
}
