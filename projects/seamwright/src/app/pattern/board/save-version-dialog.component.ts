import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Revision } from '../../core/api-types';
import { toApiError } from '../../core/api-error';
import { applyServerIssues, fieldMessage } from '../../auth/form-errors';

/** Longest version name and note the server takes (docs/api.md, "Revisions"). */
export const VERSION_NAME_MAX = 80;
export const VERSION_NOTE_MAX = 500;

/** What the dialog needs: a way to store the version (the board's autosave does it). */
export interface SaveVersionDialogData {
  save(version: { name: string; note?: string }): Promise<Revision>;
}

/** "Save as version": a name and an optional note; stays open with the reason when saving fails. */
@Component({
  selector: 'sw-save-version-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Save as version</h2>
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
      <mat-dialog-content>
        <p class="sw-muted">The drawing as it is now becomes a named revision that stands out in History.</p>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Version name</mat-label>
          <input matInput formControlName="name" required [maxlength]="nameMax" cdkFocusInitial autocomplete="off" />
          <mat-hint align="end">{{ form.controls.name.value.length }} / {{ nameMax }}</mat-hint>
          <mat-error>{{ message('name') }}</mat-error>
        </mat-form-field>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Note (optional)</mat-label>
          <textarea matInput formControlName="note" rows="3" [maxlength]="noteMax"></textarea>
          <mat-hint align="end">{{ form.controls.note.value.length }} / {{ noteMax }}</mat-hint>
          <mat-error>{{ message('note') }}</mat-error>
        </mat-form-field>
        @if (failure(); as text) { <p class="failure" role="alert">{{ text }}</p> }
        @if (busy()) { <mat-progress-bar mode="indeterminate" aria-label="Saving the version" /> }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close [disabled]="busy()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">Save version</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .wide { width: 100%; }
    .failure { color: var(--mat-sys-error); margin: 0 0 8px; }
  `,
})
export class SaveVersionDialogComponent {
  private readonly ref = inject<MatDialogRef<SaveVersionDialogComponent, Revision>>(MatDialogRef);
  private readonly data = inject<SaveVersionDialogData>(MAT_DIALOG_DATA);
  protected readonly nameMax = VERSION_NAME_MAX;
  protected readonly noteMax = VERSION_NOTE_MAX;
  protected readonly busy = signal(false);
  /** Why the last attempt failed, when no field explains it. */
  protected readonly failure = signal<string | null>(null);
  protected readonly form = inject(FormBuilder).nonNullable.group({
    name: ['', [Validators.required, Validators.maxLength(VERSION_NAME_MAX)]],
    note: ['', Validators.maxLength(VERSION_NOTE_MAX)],
  });

  protected message(field: 'name' | 'note'): string {
    return fieldMessage(field === 'name' ? 'The name' : 'The note', this.form.controls[field]);
  }

  protected async submit(): Promise<void> {
    if (this.busy()) return;
    const name = this.form.controls.name.value.trim();
    if (!name) this.form.controls.name.setValue('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    this.ref.disableClose = true;
    try {
      const note = this.form.controls.note.value.trim();
      const revision = await this.data.save(note ? { name, note } : { name });
      this.ref.close(revision);
    } catch (err: unknown) {
      const e = toApiError(err);
      const rest = applyServerIssues(this.form, e.issues);
      this.failure.set(rest.length || !e.issues.length ? `Not saved: ${e.message}` : null);
    } finally {
      this.busy.set(false);
      this.ref.disableClose = false;
    }
  }
}
