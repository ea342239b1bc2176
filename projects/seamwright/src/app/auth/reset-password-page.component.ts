import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ResetConfirmComponent } from './reset-confirm.component';
import { ResetRequestComponent } from './reset-request.component';

/** `/reset-password`: ask for a link, or (with `?token=` from the e-mail) choose a new password. */
@Component({
  selector: 'sw-reset-password-page',
  imports: [ResetConfirmComponent, ResetRequestComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `@if (token(); as t) { <sw-reset-confirm [token]="t" /> } @else { <sw-reset-request /> }`,
})
export class ResetPasswordPageComponent {
  /** The single-use token from the e-mailed link, if any. */
  readonly token = input<string | undefined>();
}
