import { Injector, afterNextRender, inject } from '@angular/core';

/**
 * Moves focus once the view has rendered the result of an action (a new row, a link that was not
 * there before), so a keyboard user carries on from the result instead of from the page's top.
 * Create it in an injection context. `focus(find)` looks the element up after the next render and
 * focuses it; when `find` finds nothing, focus stays where it is.
 */
export class FocusAfterRender {
  private readonly injector = inject(Injector);

  focus(find: () => HTMLElement | null | undefined): void {
    afterNextRender({ read: () => find()?.focus() }, { injector: this.injector });
  }
}
