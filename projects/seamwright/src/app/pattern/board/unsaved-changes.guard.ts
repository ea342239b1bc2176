import { CanDeactivateFn } from '@angular/router';

/** A page that may hold edits not yet saved. */
export interface HasUnsavedChanges {
  /** Whether leaving now would drop edits the server has not stored. */
  hasUnsavedChanges(): boolean;
}

/** Asks before leaving a page with unsaved edits. */
export const unsavedChangesGuard: CanDeactivateFn<HasUnsavedChanges> = (component) =>
  !component?.hasUnsavedChanges() || confirm('Some changes are not saved yet. Leave anyway? (A copy stays in this browser.)');
