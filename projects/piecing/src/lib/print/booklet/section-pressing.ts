import type { SeamPress } from '../../document/index';
import type { SewingStep } from '../../sewability/index';

/** Which way each patch seam of a section is pressed, by the patch number it adds. */
export type SectionPressing = Map<number, SeamPress>;

/** The pressing of one step in words (docs/design-notes.md#joining: toward the patch just added by default). */
export function pressWords(press: SeamPress, added: string, earlier: readonly string[]): string {
  if (press === 'open') return 'Press the seam open.';
  if (press === 'previous') return `Press toward ${earlier.length === 1 ? earlier[0] : 'the patches sewn before'}.`;
  return `Press toward ${added}.`;
}

/** A sewing step's press, falling back to the usual practice (toward the patch just added). */
export function pressOf(pressing: SectionPressing, step: Pick<SewingStep, 'patchNumber'>): SeamPress {
  return pressing.get(step.patchNumber) ?? 'added';
}
