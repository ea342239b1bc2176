/**
 * Every tolerance the geometry uses, in one place. Functions take these as optional parameters with
 * these values as defaults.
 */

/** Largest distance (sagitta) between an exact arc and the chords that stand for it, in inches (docs/design-notes.md#arc-flattening). */
export const CHORD_TOLERANCE_IN = 0.002;

/** Lengths closer than this are treated as equal, in inches. */
export const GEOMETRY_EPSILON_IN = 1e-7;

/** How near a seam end must come to a patch edge to count as reaching it, in inches. */
export const SEAM_REACH_TOLERANCE_IN = 0.01;

/** Integer units per inch when coordinates are handed to clipper-lib (one scale for every call). */
export const CLIPPER_SCALE = 10_000;

/** Mitre limit for seam-allowance offsets, as a multiple of the offset distance. */
export const MITRE_LIMIT = 4;

/** Smallest patch area kept when splitting, in square inches. */
export const MIN_PATCH_AREA_SQ_IN = 1e-6;

/** Precision of a patch's label point (pole of inaccessibility), in inches. */
export const LABEL_POINT_PRECISION = 0.05;
