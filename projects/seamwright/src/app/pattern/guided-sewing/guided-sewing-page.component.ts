import { ChangeDetectionStrategy, Component, ElementRef, Injector, OnInit, afterNextRender, computed, effect, inject, signal, viewChild } from '@angular/core';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { forkJoin } from 'rxjs';
import { PatternContext } from '../pattern-context.service';
import { SewingLogService } from '../../resources/sewing-log.service';
import { AuthService } from '../../core/auth.service';
import { NotifyService } from '../../core/notify.service';
import { LoadState } from '../../core/load-state';
import type { SewingLogEntry, SewingStage } from '../../core/api-types';
import { copiesAtLeast, copyKey, laterStage, stagesFromEntries } from '../sewing-log/sewing-progress';
import { GuidedStepComponent } from './guided-step.component';
import { buildSewingGuide } from './sewing-guide';
import { JOINS_PART, type GuidedPlace, type SewingGuide } from './sewing-guide-types';
import { copyCount, firstPlace, nextPlace, partOrder, placeIfValid, previousPlace, stepCount, ticksOnFinishing, type LogTick } from './guided-place';
import { GuidedPlaceStore } from './guided-place-store';
import { stepTitle } from './step-title';

const STAGE_WORDS: Record<SewingStage | 'none', string> = { none: 'Not started', pieced: 'Pieced', trimmed: 'Trimmed', joined: 'Joined' };

/**
 * Guided sewing: the quilter's step-by-step view beside the machine. Sections in joining order, one
 * piecing step at a time, then trimming, then the joins; Next ticks the sewing log as copies are
 * pieced, trimmed and joined, and the place is kept per pattern so a reload comes back to it.
 */
@Component({
  selector: 'sw-guided-sewing-page',
  imports: [RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, GuidedStepComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './guided-sewing-page.component.html',
  styleUrl: './guided-sewing-page.component.scss',
  host: { '(document:keydown)': 'onKey($event)' },
})
export class GuidedSewingPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly log = inject(SewingLogService);
  private readonly auth = inject(AuthService);
  private readonly notify = inject(NotifyService);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly injector = inject(Injector);
  private readonly store = new GuidedPlaceStore();
  private readonly heading = viewChild<ElementRef<HTMLElement>>('stepHeading');
  protected readonly state = new LoadState<SewingLogEntry[]>();
  protected readonly stages = signal<ReadonlyMap<string, SewingStage>>(new Map());
  protected readonly guide = computed<SewingGuide | null>(() => {
    const doc = this.ctx.document();
    return doc ? buildSewingGuide(doc) : null;
  });
  private readonly chosen = signal<GuidedPlace | null>(null);
  /** Where the quilter is: the chosen place, else the stored one, else the start. */
  protected readonly place = computed<GuidedPlace | null>(() => {
    const g = this.guide();
    if (!g) return null;
    return placeIfValid(g, this.chosen()) ?? placeIfValid(g, this.store.read(this.storageKey())) ?? firstPlace(g);
  });
  protected readonly finished = signal(false);
  protected readonly joinsPart = JOINS_PART;
  protected readonly section = computed(() => {
    const p = this.place();
    return p ? (this.guide()?.sections.find((s) => s.id === p.part) ?? null) : null;
  });
  protected readonly step = computed(() => {
    const p = this.place();
    return p ? (this.section()?.steps[p.step] ?? null) : null;
  });
  protected readonly join = computed(() => {
    const p = this.place();
    return p?.part === JOINS_PART ? (this.guide()?.joins[p.step] ?? null) : null;
  });
  protected readonly title = computed(() => {
    const g = this.guide();
    const p = this.place();
    return g && p ? stepTitle(g, p) : '';
  });
  protected readonly copyLine = computed(() => {
    const g = this.guide();
    const p = this.place();
    if (!g || !p) return '';
    const n = copyCount(g, p.part);
    if (p.part === JOINS_PART) return n > 1 ? `Joins · block ${p.copy} of ${n}` : 'Joins';
    return `Section ${this.section()?.label} · copy ${p.copy} of ${n}`;
  });
  /** The sewing-log stage of the copy on screen, in words. */
  protected readonly copyStage = computed(() => {
    const p = this.place();
    if (!p || p.part === JOINS_PART) return null;
    return STAGE_WORDS[this.stages().get(copyKey(p.part, p.copy)) ?? 'none'];
  });
  protected readonly parts = computed(() => {
    const g = this.guide();
    if (!g) return [];
    return partOrder(g).map((id) => {
      if (id === JOINS_PART) return { id, name: 'Joins', detail: `${g.joins.length} ${g.joins.length === 1 ? 'join' : 'joins'}` };
      const s = g.sections.find((x) => x.id === id)!;
      return { id, name: `Section ${s.label}`, detail: `${copiesAtLeast([s], this.stages(), 'pieced')} of ${s.copies} pieced` };
    });
  });
  protected readonly atStart = computed(() => {
    const g = this.guide();
    const p = this.place();
    return !g || !p || previousPlace(g, p) === null;
  });
  protected readonly atEnd = computed(() => {
    const g = this.guide();
    const p = this.place();
    return !g || !p || nextPlace(g, p) === null;
  });

  constructor() {
    // Keep the place per user and pattern, so a reload (or the next evening) comes back to it.
    effect(() => {
      const p = this.place();
      if (p && this.chosen()) this.store.write(this.storageKey(), p);
    });
  }

  ngOnInit(): void {
    this.state.run(this.log.get(this.ctx.id()), (entries) => this.stages.set(stagesFromEntries(entries)));
  }

  private storageKey(): string {
    return `${this.auth.user()?.id ?? 'anyone'}:${this.ctx.id()}`;
  }

  /** Next step; finishing a copy's last piecing step, its trimming or a join ticks the sewing log. */
  protected next(): void {
    const g = this.guide();
    const p = this.place();
    if (!g || !p) return;
    this.tick(ticksOnFinishing(g, p));
    const to = nextPlace(g, p);
    if (to) this.go(to);
    else {
      this.finished.set(true);
      this.announcer.announce('Finished: every step of the pattern is done.', 'polite');
    }
  }

  protected previous(): void {
    const g = this.guide();
    const p = this.place();
    const to = g && p ? previousPlace(g, p) : null;
    if (to) this.go(to);
  }

  /** Jumps to a part: a section at its first copy not yet trimmed, or the joins. */
  protected openPart(part: string): void {
    const g = this.guide();
    if (!g) return;
    let copy = 1;
    if (part !== JOINS_PART) {
      const n = copyCount(g, part);
      while (copy < n && (this.stages().get(copyKey(part, copy)) === 'trimmed' || this.stages().get(copyKey(part, copy)) === 'joined')) copy++;
    }
    if (stepCount(g, part) > 0) this.go({ part, copy, step: 0 });
  }

  protected onKey(event: KeyboardEvent): void {
    if (event.altKey || event.ctrlKey || event.metaKey) return;
    const target = event.target as HTMLElement | null;
    if (target?.closest('input, select, textarea, [contenteditable="true"], [role="slider"], [role="dialog"], [role="menu"]')) return;
    const key = event.key.toLowerCase();
    // Arrows belong to a tab bar or list that has focus (they move between its items); N and P still work there.
    if (key.startsWith('arrow') && (event.defaultPrevented || target?.closest('[role="tablist"], [role="listbox"], [role="radiogroup"]'))) return;
    if (key === 'arrowright' || key === 'n') {
      event.preventDefault();
      if (!this.atEnd() || !this.finished()) this.next();
    } else if (key === 'arrowleft' || key === 'p') {
      event.preventDefault();
      this.previous();
    }
  }

  private go(to: GuidedPlace): void {
    this.finished.set(false);
    this.chosen.set(to);
    this.announcer.announce(`${this.copyLine()}. ${this.title()}`, 'polite');
    // Focus follows the step, so a screen reader reads the new heading and keys carry on from it.
    afterNextRender({ read: () => this.heading()?.nativeElement.focus() }, { injector: this.injector });
  }

  private tick(ticks: LogTick[]): void {
    const before = this.stages();
    const next = new Map(before);
    const changes = ticks.filter((t) => {
      const key = copyKey(t.sectionId, t.copy);
      const stage = laterStage(before.get(key), t.stage);
      if (stage === before.get(key)) return false;
      next.set(key, stage);
      return true;
    });
    if (changes.length === 0) return;
    this.stages.set(next);
    forkJoin(changes.map((t) => this.log.mark(this.ctx.id(), t.sectionId, t.copy, t.stage))).subscribe({
      error: (err: unknown) => {
        this.stages.set(before);
        this.notify.error(err, 'The sewing log was not updated');
      },
    });
  }
}
