import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule } from '@angular/material/dialog';
import { BOARD_KEYS } from './board-keys';

/** The keyboard help: the Drafting board's keys. Opened with `?` on the board; closing gives focus back. */
@Component({
  selector: 'sw-keyboard-help-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Keys of the Drafting board</h2>
    <!-- The list may scroll on a small screen: the region takes focus so keys can scroll it. -->
    <mat-dialog-content tabindex="0" aria-label="Board keys">
      <p>Focus the board (Tab) to use them. Sections and patches can also be picked from the Sections outline.</p>
      <table>
        <caption class="cdk-visually-hidden">Board keys</caption>
        <thead>
          <tr><th scope="col">Keys</th><th scope="col">What they do</th></tr>
        </thead>
        <tbody>
          @for (k of keys; track k.keys) {
            <tr><th scope="row"><kbd>{{ k.keys }}</kbd></th><td>{{ k.does }}</td></tr>
          }
        </tbody>
      </table>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-flat-button mat-dialog-close type="button">Close</button>
    </mat-dialog-actions>
  `,
  styles: `
    table { border-collapse: collapse; width: 100%; }
    th, td { text-align: left; padding: 4px 8px; border-bottom: 1px solid var(--mat-sys-outline-variant); font: var(--mat-sys-body-medium); }
    thead th { font-weight: 500; color: var(--mat-sys-on-surface-variant); }
    kbd { font-family: inherit; font-weight: 500; }
  `,
})
export class KeyboardHelpDialogComponent {
  protected readonly keys = BOARD_KEYS;
}
