import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatIconModule } from '@angular/material/icon';
import { PatternContext } from '../pattern-context.service';
import { SewingLogService } from '../../resources/sewing-log.service';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import type { SewingLogEntry, SewingStage } from '../../core/api-types';
import { copiesAtLeast, copiesOf, copyKey, patternProgress, stagesFromEntries, stepsDone, totalSteps, type SewnSection } from './sewing-progress';

type Choice = SewingStage | 'none';

/** One section of the log and its copies. */
interface LoggedSection extends SewnSection {
  label: string;
  kind: string;
  patchCount: number;
  ringCount: number;
}

const KIND_NAMES: Record<string, string> = { arc: 'Arc section', wedge: 'Wedge section', straight: 'Straight section' };

/**
 * Sewing log: the stage each copy of each section has reached (pieced, trimmed, joined; ring repeats ×
 * blocks copies) and the pattern's progress as the share of all of them, kept per quilter.
 */
@Component({
  selector: 'sw-sewing-log-page',
  imports: [RouterLink, MatButtonModule, MatButtonToggleModule, MatProgressBarModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sewing-log-page.component.html',
  styleUrl: './sewing-log-page.component.scss',
})
export class SewingLogPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly log = inject(SewingLogService);
  private readonly notify = inject(NotifyService);
  protected readonly state = new LoadState<SewingLogEntry[]>();
  /** Stage per copy as the quilter has set it on this page (the server's answer plus changes). */
  protected readonly stages = signal<ReadonlyMap<string, SewingStage>>(new Map());
  /** The copy being saved, by {@link copyKey}. */
  protected readonly saving = signal<string | null>(null);
  protected readonly blockCount = computed(() => this.ctx.document()?.blockCount ?? 1);
  protected readonly sections = computed<LoggedSection[]>(() =>
    (this.ctx.document()?.sections ?? []).map((s) => ({
      id: s.id,
      label: s.label,
      kind: KIND_NAMES[s.geometry.kind] ?? 'Section',
      patchCount: s.patches.length,
      ringCount: s.ringRepeat?.count ?? 1,
      copies: copiesOf(s, this.blockCount()),
    })),
  );
  protected readonly progress = computed(() => patternProgress(this.sections(), this.stages()));
  protected readonly percentDone = computed(() => Math.round(this.progress() * 100));
  protected readonly done = computed(() => stepsDone(this.sections(), this.stages()));
  protected readonly total = computed(() => totalSteps(this.sections()));
  protected readonly copyCount = computed(() => this.sections().reduce((n, s) => n + s.copies, 0));
  protected readonly pieced = computed(() => copiesAtLeast(this.sections(), this.stages(), 'pieced'));
  protected readonly trimmed = computed(() => copiesAtLeast(this.sections(), this.stages(), 'trimmed'));
  protected readonly joined = computed(() => copiesAtLeast(this.sections(), this.stages(), 'joined'));

  ngOnInit(): void {
    this.state.run(this.log.get(this.ctx.id()), (entries) => this.stages.set(stagesFromEntries(entries)));
  }

  protected copyNumbers(s: LoggedSection): number[] {
    return Array.from({ length: s.copies }, (_, i) => i + 1);
  }

  /** "copy 11 of 16 (block 2)": which block a copy belongs to when the pattern is made more than once. */
  protected copyName(s: LoggedSection, copy: number): string {
    const block = this.blockCount() > 1 ? ` (block ${Math.ceil(copy / s.ringCount)})` : '';
    return `copy ${copy} of ${s.copies}${block}`;
  }

  protected countAtLeast(s: LoggedSection, stage: SewingStage): number {
    return copiesAtLeast([s], this.stages(), stage);
  }

  protected stageOf(sectionId: string, copy: number): Choice {
    return this.stages().get(copyKey(sectionId, copy)) ?? 'none';
  }

  protected set(s: LoggedSection, copy: number, choice: Choice): void {
    const key = copyKey(s.id, copy);
    const before = this.stages();
    const next = new Map(before);
    if (choice === 'none') next.delete(key);
    else next.set(key, choice);
    this.stages.set(next);
    this.saving.set(key);
    this.log.mark(this.ctx.id(), s.id, copy, choice === 'none' ? null : choice).subscribe({
      next: () => this.saving.set(null),
      error: (err: unknown) => {
        this.saving.set(null);
        this.stages.set(before);
        this.notify.error(err, `Section ${s.label}, ${this.copyName(s, copy)} not logged`);
      },
    });
  }
}
