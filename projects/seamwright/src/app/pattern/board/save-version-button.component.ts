import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { NotifyService } from '../../core/notify.service';
import type { Revision } from '../../core/api-types';
import type { BoardAutosave } from './board-autosave';
import { SaveVersionDialogComponent, type SaveVersionDialogData } from './save-version-dialog.component';

/** The part of the board's autosave this button uses. */
export type VersionSaver = Pick<BoardAutosave, 'saveVersion' | 'status'>;

/** "Save as version" on the board's bar: asks for a name and a note, then stores a named revision. */
@Component({
  selector: 'sw-save-version-button',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button mat-stroked-button type="button" (click)="open()" [disabled]="autosave().status() === 'conflict'">
      <mat-icon aria-hidden="true">bookmark_add</mat-icon>Save as version
    </button>
  `,
})
export class SaveVersionButtonComponent {
  /** The board's autosave: versions go through it so they queue behind saves and carry unsaved edits. */
  readonly autosave = input.required<VersionSaver>();
  private readonly dialog = inject(MatDialog);
  private readonly notify = inject(NotifyService);

  protected open(): void {
    const data: SaveVersionDialogData = { save: (v) => this.autosave().saveVersion(v) };
    this.dialog
      .open<SaveVersionDialogComponent, SaveVersionDialogData, Revision>(SaveVersionDialogComponent, { data, width: '480px' })
      .afterClosed()
      .subscribe((revision) => {
        if (revision) this.notify.info(`Saved as version “${revision.version?.name ?? ''}” (revision ${revision.number})`);
      });
  }
}
