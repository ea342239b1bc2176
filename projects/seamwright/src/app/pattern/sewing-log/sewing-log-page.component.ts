import { ChangeDetectionStrategy, Component, OnInit, computed, inject, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatIconModule } from '@angular/material/icon';
import { PatternContext } from '../pattern-context.service';
import { SewingLogService } from '../../resources/sewing-log.service';
import { LoadState } from '../../core/load-state';
import { NotifyService } from '../../core/notify.service';
import type { SewingLogEntry, SewingStage } from '../../core/api-types';
import { countAtLeast, patternProgress } from './sewing-progress';

type Choice = SewingStage | 'none';

/** Sewing log: every section's stage (cut, sewn, trimmed) and the pattern's progress, kept per quilter. */
@Component({
  selector: 'sw-sewing-log-page',
  imports: [MatButtonToggleModule, MatProgressBarModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sewing-log-page.component.html',
  styleUrl: './sewing-log-page.component.scss',
})
export class SewingLogPageComponent implements OnInit {
  protected readonly ctx = inject(PatternContext);
  private readonly log = inject(SewingLogService);
  private readonly notify = inject(NotifyService);
  protected readonly state = new LoadState<SewingLogEntry[]>();
  /** Stages as the quilter has set them on this page (the server's answer plus changes). */
  protected readonly stages = signal<ReadonlyMap<string, SewingStage>>(new Map());
  protected readonly saving = signal<string | null>(null);
  protected readonly sections = computed(() => this.ctx.document()?.sections ?? []);
  private readonly ids = computed(() => this.sections().map((s) => s.id));
  protected readonly progress = computed(() => patternProgress(this.ids(), this.stages()));
  protected readonly percentDone = computed(() => Math.round(this.progress() * 100));
  protected readonly sewn = computed(() => countAtLeast(this.ids(), this.stages(), 'sewn'));
  protected readonly trimmed = computed(() => countAtLeast(this.ids(), this.stages(), 'trimmed'));

  ngOnInit(): void {
    this.state.run(this.log.get(this.ctx.id()), (entries) => this.stages.set(new Map(entries.map((e) => [e.sectionId, e.stage]))));
  }

  protected stageOf(sectionId: string): Choice {
    return this.stages().get(sectionId) ?? 'none';
  }

  protected set(sectionId: string, label: string, choice: Choice): void {
    const before = this.stages();
    const next = new Map(before);
    if (choice === 'none') next.delete(sectionId);
    else next.set(sectionId, choice);
    this.stages.set(next);
    this.saving.set(sectionId);
    this.log.mark(this.ctx.id(), sectionId, choice === 'none' ? null : choice).subscribe({
      next: () => this.saving.set(null),
      error: (err: unknown) => {
        this.saving.set(null);
        this.stages.set(before);
        this.notify.error(err, `Section ${label} not logged`);
      },
    });
  }
}
