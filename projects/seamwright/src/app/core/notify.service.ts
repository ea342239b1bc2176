import { Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { describeError } from './api-error';

/** Short messages at the bottom of the screen: confirmations and errors. */
@Injectable({ providedIn: 'root' })
export class NotifyService {
  private readonly snackBar = inject(MatSnackBar);

  /** Shows a confirmation for a few seconds. */
  info(message: string): void {
    this.snackBar.open(message, 'OK', { duration: 4000, politeness: 'polite' });
  }

  /** Shows an error (an API error or any thrown value) until dismissed or for ten seconds. */
  error(err: unknown, prefix?: string): void {
    const text = describeError(err);
    this.snackBar.open(prefix ? `${prefix}: ${text}` : text, 'Dismiss', {
      duration: 10000,
      politeness: 'assertive',
      panelClass: 'sw-snack-error',
    });
  }
}
