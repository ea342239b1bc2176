import { formatCentimetres, formatInches, type PatternDocument, type Section } from '@seamwright/piecing';
import type { SectionAnalysis } from '../analysis/section-analysis';
import type { NudgeWord } from '../commands/nudge-commands';
import type { BoardSelection } from '../store/editor-state';
import type { BoardUnit } from '../view/grid-lines';

/*
 * What the board's live region says, in words: what is selected and what each key did. Pure
 * functions, so the words are tested without a browser.
 */

const KIND_WORDS: Record<Section['geometry']['kind'], string> = { straight: 'straight section', arc: 'arc section', wedge: 'wedge section' };

/** A section as the Sections outline and the live region name it: "B, arc section, 4 patches". */
export function describeSection(section: Section, analysis: SectionAnalysis): string {
  let count = 0;
  try {
    count = analysis.patches(section).length;
  } catch {
    count = 0;
  }
  return `${section.label}, ${KIND_WORDS[section.geometry.kind]}, ${count} ${count === 1 ? 'patch' : 'patches'}`;
}

/** What a selection is, in words: "Section B selected: arc section, 4 patches", "Patch A2 selected", "Nothing selected". */
export function selectionMessage(document: PatternDocument, selection: BoardSelection, analysis: SectionAnalysis): string {
  const s = selection.sectionId ? document.sections.find((x) => x.id === selection.sectionId) : undefined;
  if (!s) return 'Nothing selected';
  if (selection.patchIndex !== null) {
    const patch = analysis.patches(s).find((p) => p.index === selection.patchIndex);
    if (patch) return `Patch ${patch.label} selected`;
  }
  const [, ...rest] = describeSection(s, analysis).split(', ');
  return `Section ${s.label} selected: ${rest.join(', ')}`;
}

/** A length as the messages say it: quilters' fractions in inches ("⅛ in."), or centimetres. */
export function spokenLength(inches: number, unit: BoardUnit): string {
  return unit === 'cm' ? formatCentimetres(inches) : formatInches(inches, { style: 'unicode', denominator: 32 });
}

/** "Section B moved ⅛ in. right". */
export function nudgeMessage(sectionLabel: string, stepIn: number, word: NudgeWord, unit: BoardUnit): string {
  return `Section ${sectionLabel} moved ${spokenLength(stepIn, unit)} ${word}`;
}

/** "Undone: move section B" / "Redone: move section B"; "Nothing to undo" when there was no step. */
export function historyMessage(kind: 'undo' | 'redo', stepLabel: string | undefined): string {
  if (!stepLabel) return kind === 'undo' ? 'Nothing to undo' : 'Nothing to redo';
  const words = stepLabel.charAt(0).toLowerCase() + stepLabel.slice(1);
  return `${kind === 'undo' ? 'Undone' : 'Redone'}: ${words}`;
}
