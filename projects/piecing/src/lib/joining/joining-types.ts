import type { JoinStepInput, Point, SeamPress } from '../document/pattern-schema';

/** A joining plan as the document holds it: joins in sewing order (docs/pattern-format.md#joining-plan). */
export interface JoiningPlan {
  steps: JoinStepInput[];
}

/** One of the two parts a join sews together: a section, a ring of copies, or a unit made by an earlier join. */
export interface JoinPart {
  /** A section id (a section joined on its own), or the id of the step that made the ring or unit. */
  id: string;
  /** What a quilter reads: `A`, `the B ring`, `unit 5 (A, B, C)`. */
  label: string;
  /** Every section in the part, in document order. */
  sectionIds: string[];
}

/** The seam of a join, in block coordinates (inches, x right, y down, as drawn). */
export interface JoinSeam {
  /** `curved` when any stretch of it follows a curve (curved piecing, with matching marks). */
  kind: 'straight' | 'curved';
  /**
   * The shared stretches of edge, each an ordered polyline (arcs flattened). A closed seam (a ring sewn
   * round a centre) repeats its first point at the end. A sewable pair join has exactly one path; a ring
   * step has one path per join between neighbouring copies.
   */
  paths: Point[][];
  /** Total length of the paths, in inches. */
  lengthIn: number;
}

/** How a joined seam is pressed. */
export type JoinPress = { toward: string } | { open: true } | { ring: 'clockwise' | 'anticlockwise' };

/** A step of the joining plan with everything a page or the board shows. */
export interface ResolvedJoinStep {
  id: string;
  /** 1-based place in the plan. */
  number: number;
  kind: 'ring' | 'join';
  /** e.g. `Join the 8 copies of B into a ring`, `Join A to the B ring`. */
  label: string;
  /** For a ring step both parts are the section. */
  partA: JoinPart;
  partB: JoinPart;
  seam: JoinSeam;
  press: JoinPress;
  /** The pressing in words: `Press the seam toward the B ring`, `Press the seams open`. */
  pressLabel: string;
  /**
   * Matching marks on the curved stretches of the seam (block coordinates), from `matchingMarks`: each
   * lies on both parts' edges at the same point (within 0.001 in.), to be pinned together.
   */
  marks: Point[];
  /** Where a neighbour's corner (the end of its edge, a seam line) lands inside the other part's curved edge: marked on that edge only. */
  seamMarks: Point[];
  /** A ring step: how many copies (and joins: the last one closes the ring). */
  ringCount?: number;
  /** The unit this step makes. */
  result: JoinPart;
}

/** What can be wrong with a joining plan. */
export type JoiningProblemKind = 'inset' | 'not-touching' | 'unknown-part' | 'reused-part' | 'missing-section' | 'marks-mismatch';

/** A problem of a joining plan, in plain words naming the parts. */
export interface JoiningProblem {
  /** The step concerned; `null` for the plan as a whole (sections left out of the block). */
  stepId: string | null;
  kind: JoiningProblemKind;
  message: string;
  /** Where it is, in block coordinates: the pivot of an inset, the gap between parts that do not touch. */
  point?: Point;
}

/** The joining plan to show: the designer's, or the default one when the document has none. */
export interface ResolvedJoiningPlan {
  steps: ResolvedJoinStep[];
  problems: JoiningProblem[];
  /** Whether the plan is the library's default (the document has no joining plan). */
  isDefault: boolean;
}

/** How one patch seam of a section is pressed, resolved against the piecing order. */
export interface SeamPressing {
  seamId: string;
  press: SeamPress;
  /** The patch the seam is pressed toward (absent for `open`, or when the seam sews on no patch in a sewable order). */
  towardPatch?: number;
  /** The patch sewn on along this seam (the first, when the seam line sews several). */
  addedPatch?: number;
  /** The patch sewn before, on the other side of the seam where `addedPatch` is sewn on. */
  previousPatch?: number;
}
