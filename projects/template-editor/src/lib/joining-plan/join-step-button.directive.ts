import { Directive, ElementRef, inject, input } from '@angular/core';
import type { FocusableOption } from '@angular/cdk/a11y';

/** The button naming one join in the joining plan list: what the list's key manager moves focus between. */
@Directive({ selector: 'button[swJoinStep]' })
export class JoinStepButtonDirective implements FocusableOption {
  /** Id of the join step the button names. */
  readonly stepId = input.required<string>({ alias: 'swJoinStep' });
  private readonly el = inject<ElementRef<HTMLButtonElement>>(ElementRef);

  /** Moves focus to the button. */
  focus(): void {
    this.el.nativeElement.focus();
  }
}
