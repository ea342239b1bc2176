/*
 * Fabrication: what a quilter needs to cut and sew a pattern — seam allowances and cutting lines, strip
 * sets and guide lines, matching marks on curved edges, the cutting list and the number of template copies.
 */
export * from './seam-allowance/index';
export * from './shared/rounding';
export * from './strip-sets/index';
export * from './cutting-list/index';
export * from './matching-marks/index';
export * from './copies/index';
