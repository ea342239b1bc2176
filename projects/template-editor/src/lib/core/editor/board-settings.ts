import type { GridSnap } from '../snapping/snapping';
import type { BoardUnit } from '../view/grid-lines';

/** Board settings the designer changes from the toolbar (view state, never part of the document). */
export interface BoardSettings {
  unit: BoardUnit;
  grid: GridSnap;
  /** Whether to snap to vertices, seam ends and circle centres. */
  snapToPoints: boolean;
  /** Whether start angles and sweeps snap (ring divisions, 7.5° steps). */
  snapAngles: boolean;
  /** Whether the cutting line (seam allowance) is drawn around each section. */
  showSeamAllowance: boolean;
  /** Whether the board shows the drawing mirrored, as the printed templates are. */
  mirrored: boolean;
  /** The fabric the fill and strip-set tools use first. */
  activeFabricId: string | null;
  /** Finished widths of the strips the strip-set tool lays, in inches. */
  stripWidthsIn: number[];
  /** Copies around the circle the ring tool makes (the original included). */
  ringCount: number;
}

/** Settings a new board starts with. */
export const DEFAULT_BOARD_SETTINGS: BoardSettings = {
  unit: 'in',
  grid: 'eighth-in',
  snapToPoints: true,
  snapAngles: true,
  showSeamAllowance: false,
  mirrored: false,
  activeFabricId: null,
  stripWidthsIn: [1.5, 0.5, 1.5],
  ringCount: 8,
};
