import { readPatternDocument, type PatternDocument, type Point } from '@seamwright/piecing';
import { BoardEditor } from '../editor/board-editor';
import { toScreen } from '../view/viewport';

/** An empty 24 × 24 in. pattern with three invented fabrics. */
export function emptyPattern(): PatternDocument {
  return readPatternDocument({
    formatVersion: 1,
    title: 'Test wheel',
    canvas: { widthIn: 24, heightIn: 24 },
    fabrics: [
      { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
      { id: 'oat', name: 'Oat', colour: '#e8dcc0' },
      { id: 'sage', name: 'Sage', colour: '#8fa382' },
    ],
    sections: [],
  });
}

/** A board editor at 100 px per inch with the origin at the top-left corner, snapping to ⅛ in. */
export function testEditor(document: PatternDocument = emptyPattern()): BoardEditor {
  const editor = new BoardEditor(document);
  editor.setSize(2400, 2400);
  editor.setViewport({ scale: 100, originX: 0, originY: 0, mirrored: false, mirrorWidthIn: document.canvas.widthIn });
  return editor;
}

/** One scripted pointer step, in document inches. */
export type PointerStep = ['down' | 'move' | 'up', number, number, { altKey?: boolean; shiftKey?: boolean }?];

/** Plays pointer steps on the editor, converting inches to the editor's screen pixels. */
export function play(editor: BoardEditor, steps: readonly PointerStep[]): void {
  for (const [kind, x, y, mods] of steps) {
    const s = toScreen(editor.viewport, { x, y });
    if (kind === 'down') editor.pointerDown(s, { button: 0, ...mods });
    else if (kind === 'move') editor.pointerMove(s, mods);
    else editor.pointerUp(s, mods);
  }
}

/** A click (down and up at the same place). */
export function click(x: number, y: number, mods?: { altKey?: boolean }): PointerStep[] {
  return [
    ['down', x, y, mods],
    ['up', x, y, mods],
  ];
}

/** A point at `r` from `c` in direction `deg` (document angles). */
export function polar(c: Point, r: number, deg: number): Point {
  const a = (deg * Math.PI) / 180;
  return { x: c.x + r * Math.cos(a), y: c.y + r * Math.sin(a) };
}
