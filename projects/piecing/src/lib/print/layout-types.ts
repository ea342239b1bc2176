import type { Point } from '../document/index';
import type { Affine } from './affine';
import type { PaperName, RectIn } from './paper';
import type { SheetFrame } from './sheet-frame';
import type { PrintSegment } from './template-model';

/**
 * The plan of a print set: which template (copy, tile) goes where on which sheet. Pure data, inches
 * from each page's top-left corner (y down); the app draws its sheet preview from it and the PDF
 * writer follows it exactly.
 */
export interface PrintLayout {
  paper: PaperName;
  marginIn: number;
  /** Whether templates are mirror images (the printed side is the back of the block). */
  mirrored: boolean;
  tileOverlapIn: number;
  /** Sheets carrying templates, in print order. Page 1 of the PDF is the cover, so these start at 2. */
  sheets: PlannedSheet[];
  /** N: sheets carrying templates. */
  templateSheetCount: number;
  /** M = ceil(total template area / printable area of one sheet): no layout can use fewer sheets. */
  lowerBoundSheets: number;
  /** Sum over every printed copy of the area inside its cutting line, square inches. */
  totalTemplateAreaSqIn: number;
  /** Printable area of one sheet (inside the margins), square inches. */
  printableAreaSqIn: number;
  templates: TemplateSummary[];
}

/** One template of the set and where its prints went. */
export interface TemplateSummary {
  templateId: string;
  sectionLabel: string;
  copies: number;
  /** Tiles per copy (1 when it fits one sheet). */
  tilesPerCopy: number;
  /** Rows × columns of the tile grid, when tiled. */
  tileGrid?: { rows: number; columns: number };
  /** Page numbers carrying this template. */
  pageNumbers: number[];
}

/** One sheet of templates. */
export interface PlannedSheet {
  /** Page number in the PDF (the cover is page 1). */
  pageNumber: number;
  frame: SheetFrame;
  placements: SheetPlacement[];
  /** Section labels on this sheet, in the order placed, each once. */
  sectionLabels: string[];
}

/** One print of a template (or one tile of it) on a sheet. */
export interface SheetPlacement {
  templateId: string;
  sectionLabel: string;
  /** This print's number, 1 … copies. */
  copy: number;
  copies: number;
  /** Where the drawing lands, inches from the page's top-left (inside the content area). */
  rect: RectIn;
  /** Maps the drawing plane (inches, as seen from the front) to sheet inches; mirrors when mirrored. */
  transform: Affine;
  /** Turn applied to the template on the sheet, degrees (0 … 360), after any mirroring. */
  turnDeg: number;
  /** The caption strip above a tile (section, copy, tile key). Whole templates carry their label inside. */
  caption?: { rect: RectIn; vertical: boolean };
  /** The copy this one is nested with (same box, turned half a turn), when nested. */
  nestedWith?: number;
  /** Set when the template is split into tiles. */
  tile?: TilePlacement;
}

/** A tile of a template larger than one sheet. */
export interface TilePlacement {
  /** 1-based row and column in the tile grid, as the key reads them ("row 2, column 1"). */
  row: number;
  column: number;
  rows: number;
  columns: number;
  /** occupied[r][c]: whether tile (r + 1, c + 1) exists (tiles with nothing on them are left out). */
  occupied: boolean[][];
  /** Page numbers of the other tiles of the same copy, by "row,column" key. */
  pageOf: Record<string, number>;
  /** Whether this tile carries its copy's tile map in its sheet's header: the copy's largest tile (the first in reading order among equals). */
  first: boolean;
  /** Alignment marks in sheet inches; the neighbouring tile has the same marks at the same drawing points. */
  alignmentMarks: Point[];
  /** Where each neighbour's edge lies on this tile, sheet inches, with the neighbour's key. */
  joinLines: Array<PrintSegment & { neighbour: string }>;
}
