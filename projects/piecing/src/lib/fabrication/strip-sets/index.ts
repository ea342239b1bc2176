export * from './strip-set-layout';
export * from './section-guide-lines';
