import { TOOL_CATALOGUE } from '../toolbar/tool-catalogue';

/** One line of the board's key list: the keys, and what they do. */
export interface BoardKeyLine {
  keys: string;
  does: string;
}

/** The board's own keys, in the order the keyboard help lists them. */
export const BOARD_KEYS: readonly BoardKeyLine[] = [
  { keys: 'Arrow keys', does: 'Move the selected section by the snap step' },
  { keys: 'Shift + arrow keys', does: 'Move the selected section by 1 in. (1 cm on a metric board)' },
  { keys: 'Delete', does: 'Remove the selected section' },
  { keys: 'Escape', does: 'Clear the selection, or drop what a tool has half done' },
  { keys: 'Ctrl + Z', does: 'Undo' },
  { keys: 'Ctrl + Shift + Z or Ctrl + Y', does: 'Redo' },
  { keys: 'Ctrl + C, Ctrl + X, Ctrl + V', does: 'Copy, cut, paste the selected section' },
  { keys: '+ and −', does: 'Zoom in and out' },
  { keys: '0', does: 'Fit the drawing to the board' },
  ...TOOL_CATALOGUE.map((t) => ({ keys: t.key, does: `${t.name} tool` })),
  { keys: 'Tab', does: 'Leave the board' },
  { keys: '?', does: 'Show these keys' },
];

/** The key list in one sentence, for the board's description. */
export function boardKeysSentence(): string {
  return `Keys: ${BOARD_KEYS.map((k) => `${k.keys}: ${k.does.charAt(0).toLowerCase()}${k.does.slice(1)}`).join('; ')}. Select a section from the Sections outline.`;
}
