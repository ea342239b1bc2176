/* Sewability check and order search (docs/design-notes.md#sewability). */
export * from './sewability-types';
export * from './check-sewability';
export * from './find-sewable-order';
export * from './suggest-split';
export type { AddCheck } from './patch-contacts';
