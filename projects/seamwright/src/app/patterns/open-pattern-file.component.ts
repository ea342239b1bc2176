import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { PatternsService } from '../resources/patterns.service';
import { NotifyService } from '../core/notify.service';
import { toApiError } from '../core/api-error';
import {
  displayPath,
  problemsFromServer,
  readPatternFile,
  type PatternFileProblem,
} from '../pattern-files/read-pattern-file';

/**
 * "Open a pattern file": reads a `.seamwright.json` file in the browser, checks it with the piecing
 * library's parser and, when it is valid, makes a new pattern of it and opens its Drafting board. When it
 * is not, every problem is listed with its path and nothing is saved.
 */
@Component({
  selector: 'sw-open-pattern-file',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'sw-open-pattern-file' },
  template: `
    <input
      #fileInput
      type="file"
      class="sw-sr-only"
      accept=".json,application/json"
      aria-label="Pattern file"
      tabindex="-1"
      (change)="open(fileInput)"
    />
    <button mat-stroked-button type="button" (click)="fileInput.click()" [disabled]="busy()">
      <mat-icon aria-hidden="true">upload_file</mat-icon>Open a pattern file
    </button>
    @if (problems(); as list) {
      <section class="problems" role="alert" aria-labelledby="pattern-file-problems-title">
        <h2 id="pattern-file-problems-title">
          “{{ fileName() }}” was not opened: {{ list.length === 1 ? '1 problem' : list.length + ' problems' }}. Nothing was saved.
        </h2>
        <ul aria-label="Problems in the pattern file">
          @for (p of list; track $index) {
            <li><code>{{ displayPath(p.path) }}</code>: {{ p.message }}</li>
          }
        </ul>
        <button mat-button type="button" (click)="problems.set(null)">Close</button>
      </section>
    }
  `,
  styles: `
    :host { display: contents; }
    .problems {
      flex-basis: 100%;
      border: 1px solid var(--mat-sys-error);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
      border-radius: 12px;
      padding: 12px 16px;
    }
    h2 { margin: 0 0 8px; font: var(--mat-sys-title-small); }
    ul { margin: 0 0 8px; padding-left: 20px; max-height: 40vh; overflow: auto; }
    li { margin: 2px 0; }
    code { font-weight: 600; }
  `,
})
export class OpenPatternFileComponent {
  private readonly patterns = inject(PatternsService);
  private readonly notify = inject(NotifyService);
  private readonly router = inject(Router);
  protected readonly displayPath = displayPath;
  protected readonly busy = signal(false);
  /** Problems of the last file chosen, or null when there is nothing to show. */
  protected readonly problems = signal<PatternFileProblem[] | null>(null);
  protected readonly fileName = signal('');

  protected async open(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.problems.set(null);
    this.fileName.set(file.name);
    this.busy.set(true);
    const reading = await readPatternFile(file);
    if (!reading.ok) {
      this.busy.set(false);
      this.problems.set(reading.problems);
      return;
    }
    this.patterns.create(reading.document).subscribe({
      next: (created) => {
        this.busy.set(false);
        this.notify.info(
          reading.droppedTraceImage
            ? `“${created.pattern.title}” opened as a new pattern. Its traced image is not in the file: trace it again on the board.`
            : `“${created.pattern.title}” opened as a new pattern`,
        );
        void this.router.navigate(['/patterns', created.pattern.id, 'board']);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        const e = toApiError(err);
        if (e.status === 400 && e.issues.length) this.problems.set(problemsFromServer(e.issues));
        else this.notify.error(e, 'The pattern file was not saved');
      },
    });
  }
}
