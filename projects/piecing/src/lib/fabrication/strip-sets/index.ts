export * from './strip-set-layout';
export * from './section-guide-lines';
export * from './strip-set-name';
export * from './strip-bands';
