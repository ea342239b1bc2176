import Konva from 'konva';
import { gridLines, toScreen, type BoardUnit, type Viewport } from '../../core/public-api';
import { BOARD_COLOURS } from './board-colours';

/** What the grid and rulers need to draw themselves. */
export interface GridView {
  viewport: Viewport;
  widthPx: number;
  heightPx: number;
  unit: BoardUnit;
  canvasWidthIn: number;
  canvasHeightIn: number;
  cursorPx: { x: number; y: number } | null;
}

/** Ruler band thickness, in pixels. */
export const RULER_PX = 24;

/** The desk, the drawing area and the grid, drawn in screen space in one pass (never listening). */
export function createGridShape(view: () => GridView): Konva.Shape {
  return new Konva.Shape({
    listening: false,
    perfectDrawEnabled: false,
    sceneFunc(context) {
      const v = view();
      const ctx = context._context;
      ctx.fillStyle = BOARD_COLOURS.desk;
      ctx.fillRect(0, 0, v.widthPx, v.heightPx);
      const a = toScreen(v.viewport, { x: 0, y: 0 });
      const b = toScreen(v.viewport, { x: v.canvasWidthIn, y: v.canvasHeightIn });
      ctx.fillStyle = BOARD_COLOURS.paper;
      ctx.fillRect(Math.min(a.x, b.x), a.y, Math.abs(b.x - a.x), b.y - a.y);
      const g = gridLines(v.viewport, v.widthPx, v.heightPx, v.unit);
      for (const major of [false, true]) {
        ctx.beginPath();
        for (const l of g.vertical) {
          if (l.major !== major) continue;
          ctx.moveTo(Math.round(l.px) + 0.5, 0);
          ctx.lineTo(Math.round(l.px) + 0.5, v.heightPx);
        }
        for (const l of g.horizontal) {
          if (l.major !== major) continue;
          ctx.moveTo(0, Math.round(l.px) + 0.5);
          ctx.lineTo(v.widthPx, Math.round(l.px) + 0.5);
        }
        ctx.strokeStyle = major ? BOARD_COLOURS.gridMajor : BOARD_COLOURS.gridMinor;
        ctx.lineWidth = 1;
        ctx.stroke();
      }
      ctx.strokeStyle = BOARD_COLOURS.gridMajor;
      ctx.strokeRect(Math.min(a.x, b.x) + 0.5, a.y + 0.5, Math.abs(b.x - a.x), b.y - a.y);
    },
  });
}

/** A ruler number: the grid value in the board unit, to three decimals at most. */
function label(value: number): string {
  return `${Math.round(value * 1000) / 1000}`;
}

/** The rulers along the top and left edges with the cursor marked, in screen space. */
export function createRulerShape(view: () => GridView): Konva.Shape {
  return new Konva.Shape({
    listening: false,
    perfectDrawEnabled: false,
    sceneFunc(context) {
      const v = view();
      const ctx = context._context;
      const g = gridLines(v.viewport, v.widthPx, v.heightPx, v.unit);
      ctx.fillStyle = BOARD_COLOURS.rulerBand;
      ctx.fillRect(0, 0, v.widthPx, RULER_PX);
      ctx.fillRect(0, 0, RULER_PX, v.heightPx);
      ctx.strokeStyle = BOARD_COLOURS.gridMajor;
      ctx.beginPath();
      ctx.moveTo(0, RULER_PX + 0.5);
      ctx.lineTo(v.widthPx, RULER_PX + 0.5);
      ctx.moveTo(RULER_PX + 0.5, 0);
      ctx.lineTo(RULER_PX + 0.5, v.heightPx);
      ctx.stroke();
      ctx.fillStyle = BOARD_COLOURS.rulerInk;
      ctx.strokeStyle = BOARD_COLOURS.rulerInk;
      ctx.font = '10px Roboto, sans-serif';
      ctx.textBaseline = 'top';
      ctx.beginPath();
      for (const l of g.vertical) {
        if (l.px < RULER_PX) continue;
        const x = Math.round(l.px) + 0.5;
        ctx.moveTo(x, l.major ? 8 : 17);
        ctx.lineTo(x, RULER_PX);
        if (l.major) ctx.fillText(label(l.value), x + 2, 2);
      }
      ctx.stroke();
      ctx.save();
      ctx.beginPath();
      for (const l of g.horizontal) {
        if (l.px < RULER_PX) continue;
        const y = Math.round(l.px) + 0.5;
        ctx.moveTo(l.major ? 8 : 17, y);
        ctx.lineTo(RULER_PX, y);
      }
      ctx.stroke();
      for (const l of g.horizontal) {
        if (l.px < RULER_PX || !l.major) continue;
        ctx.save();
        ctx.translate(2, Math.round(l.px) + 2);
        ctx.rotate(Math.PI / 2);
        ctx.fillText(label(l.value), 0, -10);
        ctx.restore();
      }
      ctx.restore();
      ctx.fillStyle = BOARD_COLOURS.rulerBand;
      ctx.fillRect(0, 0, RULER_PX, RULER_PX);
      ctx.fillStyle = BOARD_COLOURS.rulerInk;
      ctx.fillText(v.unit, 4, 7);
    },
  });
}
