import { DOCUMENT, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import { PatternContext } from '../pattern-context.service';
import { RevisionsService } from '../../resources/revisions.service';
import { NotifyService } from '../../core/notify.service';
import { StaleSaveError } from '../../resources/patterns.service';
import { FocusAfterRender } from '../../core/focus-after-render';

/** Restores an old revision as the newest one (create in an injection context). */
export class RevisionRestore {
  private readonly ctx = inject(PatternContext);
  private readonly revisions = inject(RevisionsService);
  private readonly notify = inject(NotifyService);
  private readonly router = inject(Router);
  private readonly doc = inject(DOCUMENT);
  private readonly focusAfter = new FocusAfterRender();
  readonly busy = signal(false);

  constructor(private readonly after?: () => void) {}

  restore(n: number): void {
    if (!confirm(`Make revision ${n} the newest revision? The current one stays in History.`)) return;
    this.busy.set(true);
    this.revisions.restore(this.ctx.id(), n, this.ctx.revision()).subscribe({
      next: (r) => {
        this.busy.set(false);
        this.ctx.adopt(r.revision.document, r.revision.number);
        this.notify.info(`Revision ${n} restored as revision ${r.revision.number}`);
        this.after?.();
        // The result is the board with the restored drawing: focus goes to the page's content (the
        // app's main region), not to the body the Restore button leaves behind.
        void this.router.navigate(['/patterns', this.ctx.id(), 'board']).then(() => this.focusAfter.focus(() => this.doc.getElementById('main')));
      },
      error: (err: unknown) => {
        this.busy.set(false);
        if (err instanceof StaleSaveError) {
          this.ctx.adopt(err.latest.document, err.latest.number);
          this.notify.error(err, 'Someone saved in the meantime; History is up to date now, try again');
          this.after?.();
        } else this.notify.error(err, 'Not restored');
      },
    });
  }
}
