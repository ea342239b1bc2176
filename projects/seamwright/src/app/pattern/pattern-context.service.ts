import { Injectable, computed, inject, signal } from '@angular/core';
import type { PatternDocument } from '@seamwright/piecing';
import { LoadState } from '../core/load-state';
import type { PatternWithRevision } from '../core/api-types';
import { PatternsService } from '../resources/patterns.service';

/**
 * The pattern open on the pattern page, shared by its parts (board, cutting list, print …).
 * Provided by the pattern page, so each open pattern has its own.
 */
@Injectable()
export class PatternContext {
  private readonly patterns = inject(PatternsService);
  /** The pattern as loaded from the server. */
  readonly state = new LoadState<PatternWithRevision>({ snackOnError: true });
  readonly detail = this.state.value;
  readonly id = signal('');
  /** The latest saved document (the board's unsaved edits live on the board page). */
  readonly document = signal<PatternDocument | null>(null);
  /** The revision `document` belongs to. */
  readonly revision = signal(0);
  /** Whether the user may change the design (owner or co-designer). */
  readonly canEdit = computed(() => {
    const a = this.detail()?.pattern.access;
    return a === 'owner' || a === 'co-designer';
  });
  readonly isOwner = computed(() => this.detail()?.pattern.access === 'owner');
  readonly title = computed(() => this.document()?.title ?? this.detail()?.pattern.title ?? '');

  load(id: string): void {
    this.id.set(id);
    this.state.run(this.patterns.get(id), (d) => this.adopt(d.revision.document, d.revision.number));
  }

  reload(): void {
    this.load(this.id());
  }

  /** Takes a document the server now holds as revision `number`. */
  adopt(document: PatternDocument, number: number): void {
    this.document.set(document);
    this.revision.set(number);
  }
}
