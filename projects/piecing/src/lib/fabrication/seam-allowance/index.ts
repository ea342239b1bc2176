export * from './clipper-offset';
export * from './section-seam-allowance';
