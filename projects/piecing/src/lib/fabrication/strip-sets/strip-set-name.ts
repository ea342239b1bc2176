/** How many patch labels a fallback name lists before it says how many more there are. */
const LABELS_SHOWN = 3;

/**
 * What quilters call a strip set: its name, or, when it has none, the patches it fills ("Strip set for
 * A3", "Strip set for A3, B2, C1 and 4 more"), never its internal id. Repeated labels (ring-repeat copies
 * share them) are listed once.
 */
export function stripSetDisplayName(name: string | null | undefined, patchLabels: readonly string[]): string {
  const given = name?.trim();
  if (given) return given;
  const labels = [...new Set(patchLabels)];
  if (labels.length === 0) return 'Strip set';
  const shown = labels.slice(0, LABELS_SHOWN).join(', ');
  const more = labels.length - LABELS_SHOWN;
  return `Strip set for ${shown}${more > 0 ? ` and ${more} more` : ''}`;
}
