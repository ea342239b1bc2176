import type { ToolId } from '../tools/tool';

/** One-key shortcuts for the tools (no modifier). */
export const TOOL_SHORTCUTS: Readonly<Record<string, ToolId>> = {
  v: 'select',
  s: 'straight',
  a: 'arc',
  w: 'wedge',
  l: 'split',
  r: 'ring',
  f: 'fill',
  t: 'strip-set',
  n: 'renumber',
  d: 'delete',
  h: 'pan',
};

/** A key press as the editor reads it (DOM KeyboardEvent fits). */
export interface BoardKey {
  key: string;
  ctrlKey?: boolean;
  metaKey?: boolean;
  shiftKey?: boolean;
  altKey?: boolean;
}

/** Editor actions bound to keys with Ctrl (or ⌘). */
export type BoardAction = 'undo' | 'redo' | 'copy' | 'paste' | 'cut' | 'fit' | 'zoom-in' | 'zoom-out';

/** The action a key press asks for, if any. */
export function actionFor(e: BoardKey): BoardAction | null {
  const mod = e.ctrlKey || e.metaKey;
  const k = e.key.toLowerCase();
  if (mod && k === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (mod && k === 'y') return 'redo';
  if (mod && k === 'c') return 'copy';
  if (mod && k === 'v') return 'paste';
  if (mod && k === 'x') return 'cut';
  if (!mod && (k === '0' || (e.shiftKey && k === '!'))) return 'fit';
  if (!mod && (k === '+' || k === '=')) return 'zoom-in';
  if (!mod && (k === '-' || k === '_')) return 'zoom-out';
  return null;
}
