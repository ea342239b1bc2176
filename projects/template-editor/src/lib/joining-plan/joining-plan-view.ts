import type { ResolvedJoinStep } from '@seamwright/piecing';
import type { JoinPress, RingPress } from '../core/public-api';

/** A pressing a join may be given, with its words. */
export interface JoinPressOption {
  value: RingPress | JoinPress;
  label: string;
}

/** The pressings a join offers, in words naming its parts. */
export function joinPressOptions(step: ResolvedJoinStep): JoinPressOption[] {
  if (step.kind === 'ring') {
    return [
      { value: 'clockwise', label: 'All one way, clockwise' },
      { value: 'anticlockwise', label: 'All one way, anticlockwise' },
      { value: 'open', label: 'Open' },
    ];
  }
  return [
    { value: 'a', label: `Toward ${step.partA.label}` },
    { value: 'b', label: `Toward ${step.partB.label}` },
    { value: 'open', label: 'Open' },
  ];
}

/** The document's pressing value of a resolved join (the select's value). */
export function joinPressValue(step: ResolvedJoinStep): RingPress | JoinPress {
  const p = step.press;
  if ('open' in p) return 'open';
  if ('ring' in p) return p.ring;
  return p.toward === step.partB.id ? 'b' : 'a';
}

/** What a problem of the plan is, in a few words before its message. */
export function joiningProblemKindText(kind: string): string {
  switch (kind) {
    case 'inset':
      return 'Inset seam';
    case 'not-touching':
      return 'Parts do not meet';
    case 'unknown-part':
      return 'Part not made yet';
    case 'reused-part':
      return 'Part joined twice';
    case 'missing-section':
      return 'Section left out';
    case 'marks-mismatch':
      return 'Matching marks differ';
    default:
      return 'Problem';
  }
}
