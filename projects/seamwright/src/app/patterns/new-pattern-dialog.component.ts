import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { STARTERS } from './starters';
import { fieldMessage } from '../auth/form-errors';

/** What the dialog hands back. */
export interface NewPatternChoice {
  title: string;
  starterId: string;
}

/** "New pattern": a title and where to start from. */
@Component({
  selector: 'sw-new-pattern-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatRadioModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>New pattern</h2>
    <form [formGroup]="form" (ngSubmit)="create()" novalidate>
      <mat-dialog-content>
        <mat-form-field appearance="outline" class="title">
          <mat-label>Title</mat-label>
          <input matInput formControlName="title" required cdkFocusInitial />
          <mat-error>{{ message() }}</mat-error>
        </mat-form-field>
        <fieldset class="sw-fieldset">
          <legend>Start from</legend>
          <mat-radio-group formControlName="starterId" class="sw-radio-column" aria-label="Start from">
            @for (s of starters; track s.id) {
              <mat-radio-button [value]="s.id">
                <span class="starter-name">{{ s.name }}</span> — <span class="sw-muted">{{ s.description }}</span>
              </mat-radio-button>
            }
          </mat-radio-group>
        </fieldset>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit">Create</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `.title { width: 100%; } .starter-name { font-weight: 500; }`,
})
export class NewPatternDialogComponent {
  private readonly ref = inject<MatDialogRef<NewPatternDialogComponent, NewPatternChoice>>(MatDialogRef);
  protected readonly starters = STARTERS;
  protected readonly form = inject(FormBuilder).nonNullable.group({
    title: ['', [Validators.required, Validators.maxLength(120)]],
    starterId: ['blank', Validators.required],
  });

  protected message(): string {
    return fieldMessage('Title', this.form.controls.title);
  }

  protected create(): void {
    const title = this.form.controls.title.value.trim();
    if (!title) this.form.controls.title.setValue('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.ref.close({ title, starterId: this.form.controls.starterId.value });
  }
}
