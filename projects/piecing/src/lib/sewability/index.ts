/* Sewability check and order search (design.md §5.3). */
export * from './sewability-types';
export * from './check-sewability';
export * from './find-sewable-order';
export * from './suggest-split';
export type { AddCheck } from './patch-contacts';
