/*
 * Geometry of pattern sections: polygon basics, arc flattening, section outlines, ring repeats and
 * splitting a section into patches by its seams. Pure functions, inches and radians/degrees in the names.
 */
export * from './vector';
export * from './polygon';
export * from './segment';
export * from './clean-ring';
export * from './self-crossing';
export * from './arc';
export * from './curved-edge';
export * from './edge-circles';
export * from './section-outline';
export * from './ring-repeat';
export * from './split-polygon';
export * from './derive-patches';
export * from './label-point';
export * from './simplify-ring';
