export * from './cutting-list-types';
export * from './min-area-rectangle';
export * from './patch-rough-cut';
export * from './wof-strips';
export * from './build-cutting-list';
export * from './rough-cut-fit';
