import type { Point } from '../document/pattern-schema';

/** Why a patch cannot be sewn at its place in the order (docs/design-notes.md#sewability). */
export type SewabilityFailureReason =
  /** The patch shares no seam (no stretch of edge) with the patches sewn before it. */
  | 'no-shared-seam'
  /** It meets the earlier patches along more than one line, or in separate pieces along one line. */
  | 'not-one-straight-seam'
  /** The earlier patches lie on both sides of the line through its seam: folding there would cut sewn fabric. */
  | 'earlier-patches-both-sides'
  /** The patch itself reaches across the line of its seam: one flipped piece of fabric cannot cover it. */
  | 'patch-crosses-seam-line'
  /** The order given does not list each patch number exactly once. */
  | 'order-mismatch';

/** The first patch that cannot be sewn, and why. */
export interface SewabilityFailure {
  /** Patch number, and its place in the order (1-based). */
  patchNumber: number;
  label: string;
  position: number;
  reason: SewabilityFailureReason;
  message: string;
}

/** The seam a patch is sewn along: the stretch it shares with the patches sewn before it. */
export interface SewingStep {
  patchNumber: number;
  label: string;
  from: Point;
  to: Point;
}

/** Outcome of checking one order. */
export interface SewabilityVerdict {
  sewable: boolean;
  /** The order checked, as patch numbers. */
  order: number[];
  /** Labels in the order checked (`A1`, `A2` …). */
  labels: string[];
  /** The seam of each patch after the first, up to the first failure. */
  steps: SewingStep[];
  failure?: SewabilityFailure;
}

/** A suggested cut that splits an unsewable section into two sections that are each sewable. */
export interface SplitSuggestion {
  /** The cut, along existing seams, from one side of the section to the other. */
  from: Point;
  to: Point;
  /** Patch numbers on each side of the cut, each in a sewable order. */
  parts: [number[], number[]];
  message: string;
}

/**
 * Outcome of an order search: `sewable` (an order was found), `unsewable` (no order exists) or
 * `undecided` (the search spent its work budget before it could tell either way; it never guesses).
 */
export type SewableOrderStatus = 'sewable' | 'unsewable' | 'undecided';

/** Outcome of an order search. */
export type SewableOrderResult =
  | { found: true; status: 'sewable'; order: number[]; labels: string[]; message: string }
  | {
      found: false;
      status: 'unsewable' | 'undecided';
      /** 'none': no sewable order exists; 'search-limit': the search could not decide within its budget. */
      reason: 'none' | 'search-limit';
      message: string;
      /** A straight cut into two sections that can each be sewn, when the search found one. */
      suggestion?: SplitSuggestion;
    };

/** Tolerances and limits of the sewability check and order search. */
export interface SewabilityOptions {
  /** Points this close to a line count as on it, in inches. */
  toleranceIn?: number;
  /** Shared stretches shorter than this are corner contacts, not seams, in inches. */
  minSeamLengthIn?: number;
  /** Chord tolerance used when a section is given and its patches must be derived, in inches. */
  chordToleranceIn?: number;
  /**
   * Work budget of one order search, split advice included: patches tried plus sets expanded (counted,
   * not timed, so the answer is the same on every machine). Past it the answer is `undecided`.
   */
  maxSearchStates?: number;
}
