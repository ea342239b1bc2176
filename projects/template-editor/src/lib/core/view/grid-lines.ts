import { CM_PER_INCH } from '@seamwright/piecing';
import { toDocument, type Viewport } from './viewport';

/** The unit the board's grid and read-outs use. */
export type BoardUnit = 'in' | 'cm';

/** One grid line, in screen pixels. */
export interface GridLine {
  /** Screen position across the line (x for vertical lines, y for horizontal ones). */
  px: number;
  /** Document position, in the board unit (for ruler labels). */
  value: number;
  major: boolean;
}

/** The lines of the board grid for a view. */
export interface GridLines {
  vertical: GridLine[];
  horizontal: GridLine[];
  /** Minor step, in the board unit. */
  minorStep: number;
  /** Major step, in the board unit. */
  majorStep: number;
}

const INCH_STEPS = [1 / 8, 1 / 4, 1 / 2, 1, 2, 6, 12, 24];
const CM_STEPS = [0.5, 1, 2, 5, 10, 20, 50];

/** The smallest step of the unit whose lines are at least `minGapPx` apart, and a major step over it. */
export function gridSteps(scalePxPerIn: number, unit: BoardUnit, minGapPx = 10): { minor: number; major: number } {
  const pxPerUnit = unit === 'in' ? scalePxPerIn : scalePxPerIn / CM_PER_INCH;
  const steps = unit === 'in' ? INCH_STEPS : CM_STEPS;
  const minor = steps.find((s) => s * pxPerUnit >= minGapPx) ?? steps[steps.length - 1];
  const majorBase = unit === 'in' ? 1 : 5;
  const major = steps.find((s) => s >= Math.max(majorBase, minor * 4) && s * pxPerUnit >= minGapPx * 4) ?? minor * 4;
  return { minor, major };
}

function lines(fromUnit: number, toUnit: number, step: number, major: number, toPx: (value: number) => number): GridLine[] {
  const out: GridLine[] = [];
  const first = Math.ceil(Math.min(fromUnit, toUnit) / step);
  const last = Math.floor(Math.max(fromUnit, toUnit) / step);
  for (let i = first; i <= last && out.length < 2000; i++) {
    const value = i * step;
    const ratio = value / major;
    out.push({ px: toPx(value), value, major: Math.abs(ratio - Math.round(ratio)) < 1e-9 });
  }
  return out;
}

/** The grid lines visible in a widthPx × heightPx view. */
export function gridLines(v: Viewport, widthPx: number, heightPx: number, unit: BoardUnit): GridLines {
  const { minor, major } = gridSteps(v.scale, unit);
  const k = unit === 'in' ? 1 : CM_PER_INCH;
  const tl = toDocument(v, { x: 0, y: 0 });
  const br = toDocument(v, { x: widthPx, y: heightPx });
  const xPx = (valueUnit: number) => {
    const xIn = valueUnit / k;
    return v.originX + (v.mirrored ? v.mirrorWidthIn - xIn : xIn) * v.scale;
  };
  const yPx = (valueUnit: number) => v.originY + (valueUnit / k) * v.scale;
  return {
    vertical: lines(tl.x * k, br.x * k, minor, major, xPx),
    horizontal: lines(tl.y * k, br.y * k, minor, major, yPx),
    minorStep: minor,
    majorStep: major,
  };
}
