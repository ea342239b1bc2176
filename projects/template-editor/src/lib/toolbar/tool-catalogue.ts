import type { GridSnap, ToolId } from '../core/public-api';

/** A tool as the toolbar offers it. */
export interface ToolEntry {
  id: ToolId;
  name: string;
  /** The key that picks it (shown in the button's title). */
  key: string;
  /** Whether it changes the drawing (hidden on a read-only board). */
  edits: boolean;
}

/** The toolbar's tools, in order (names from the product's vocabulary). */
export const TOOL_CATALOGUE: readonly ToolEntry[] = [
  { id: 'select', name: 'Select', key: 'V', edits: false },
  { id: 'pan', name: 'Pan', key: 'H', edits: false },
  { id: 'straight', name: 'Straight section', key: 'S', edits: true },
  { id: 'arc', name: 'Arc section', key: 'A', edits: true },
  { id: 'wedge', name: 'Wedge section', key: 'W', edits: true },
  { id: 'split', name: 'Split', key: 'L', edits: true },
  { id: 'ring', name: 'Ring repeat', key: 'R', edits: true },
  { id: 'fill', name: 'Fabric fill', key: 'F', edits: true },
  { id: 'strip-set', name: 'Strip set', key: 'T', edits: true },
  { id: 'renumber', name: 'Renumber', key: 'N', edits: true },
  { id: 'delete', name: 'Delete', key: 'D', edits: true },
];

/** Grid snap choices as the toolbar names them. */
export const GRID_SNAP_CHOICES: ReadonlyArray<{ value: GridSnap; name: string }> = [
  { value: 'off', name: 'Off' },
  { value: 'eighth-in', name: '⅛ in.' },
  { value: 'quarter-in', name: '¼ in.' },
  { value: 'half-in', name: '½ in.' },
  { value: 'half-cm', name: '0.5 cm' },
];
