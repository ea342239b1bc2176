import type { PatternDocument } from '@seamwright/piecing';

/** Pattern-wide settings the properties panel edits. */
export interface PatternSettingsChange {
  seamAllowanceIn?: number;
  canvas?: { widthIn: number; heightIn: number };
  displayUnit?: 'in' | 'cm';
}

/** Changes pattern-wide settings (seam allowance, drawing area, preferred unit). */
export function setPatternSettings(document: PatternDocument, change: PatternSettingsChange): PatternDocument {
  const next = { ...document };
  if (change.seamAllowanceIn !== undefined && change.seamAllowanceIn > 0 && change.seamAllowanceIn <= 2) next.seamAllowanceIn = change.seamAllowanceIn;
  if (change.canvas && change.canvas.widthIn > 0 && change.canvas.heightIn > 0) next.canvas = { widthIn: change.canvas.widthIn, heightIn: change.canvas.heightIn };
  if (change.displayUnit) next.displayUnit = change.displayUnit;
  return next;
}
