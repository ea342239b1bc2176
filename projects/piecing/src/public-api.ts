/*
 * Public API of @seamwright/piecing: the pattern document, geometry, sewability, seam allowance,
 * cutting list and print sets. Import from '@seamwright/piecing' only, never from deep paths.
 * Each folder keeps its own index.ts; add exports there, not here.
 */
export * from './lib/tolerance';
export * from './lib/document/index';
export * from './lib/geometry/index';
export * from './lib/fabrication/index';
export * from './lib/demo/index';
export * from './lib/print/index';
export * from './lib/sewability/index';
export * from './lib/units/index';
