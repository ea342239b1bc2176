import { LiveAnnouncer } from '@angular/cdk/a11y';
import { FocusKeyManager } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, afterNextRender, computed, effect, inject, output, signal, viewChildren } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { resolveJoiningPlan, type ResolvedJoiningPlan, type ResolvedJoinStep } from '@seamwright/piecing';
import {
  adoptDefaultJoiningPlan,
  joiningStepMoveProblem,
  moveJoiningStep,
  resetJoiningPlan,
  setJoiningStepPress,
  type BoardHighlight,
  type JoinPress,
  type RingPress,
} from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { JoinStepButtonDirective } from './join-step-button.directive';
import { joinPressOptions, joinPressValue, joiningProblemKindText } from './joining-plan-view';

/**
 * The joining plan of the pattern (docs/pattern-format.md#joining-plan): the joins in sewing order with
 * their pressing, the plan's problems in words, "Use this plan" while the plan is the program's
 * proposal, and moving a join earlier or later (buttons, or Alt+↑/↓ on a join; ↑/↓ move between joins).
 * Choosing a join points at its seam and matching marks on the board (`highlightChange`). The plan is
 * worked out only while the panel is open, and not again during a drag.
 */
@Component({
  selector: 'sw-joining-plan-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatSelectModule, JoinStepButtonDirective],
  templateUrl: './joining-plan-panel.component.html',
  styleUrl: './joining-plan-panel.component.scss',
})
export class JoiningPlanPanelComponent {
  /** The seam and marks of the chosen join, to draw on the board; null when none is chosen or the panel is closed. */
  readonly highlightChange = output<BoardHighlight | null>();

  protected readonly session = inject(EditorSession);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly injector = inject(Injector);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  protected readonly ro = this.session.readOnly;
  /** Whether the panel is open. */
  protected readonly open = signal(false);
  /** The join whose seam the board points at. */
  protected readonly selectedStepId = signal<string | null>(null);
  /** Why the last move was refused, in words. */
  protected readonly moveProblem = signal<string | null>(null);
  private lastPlan: { plan: ResolvedJoiningPlan | null; error: string | null } = { plan: null, error: null };

  /** The resolved plan (the designer's, or the proposal), or why it could not be worked out. */
  private readonly resolved = computed(() => {
    if (!this.open()) return { plan: null, error: null };
    const snapshot = this.session.snapshot();
    // A drag changes the document on every frame; the plan follows when it ends.
    if (snapshot.origin === 'gesture' && this.lastPlan.plan) return this.lastPlan;
    try {
      this.lastPlan = { plan: resolveJoiningPlan(snapshot.document), error: null };
    } catch (err) {
      this.lastPlan = { plan: null, error: err instanceof Error ? err.message : String(err) };
    }
    return this.lastPlan;
  });
  protected readonly plan = computed(() => this.resolved().plan);
  protected readonly error = computed(() => this.resolved().error);
  /** Numbers of the joins with a problem. */
  protected readonly stepsWithProblems = computed(() => new Set((this.plan()?.problems ?? []).map((p) => p.stepId).filter((id) => id !== null)));
  protected readonly selectedStep = computed(() => this.plan()?.steps.find((s) => s.id === this.selectedStepId()) ?? null);

  private readonly stepButtons = viewChildren(JoinStepButtonDirective);
  private readonly keys = new FocusKeyManager<JoinStepButtonDirective>(this.stepButtons, this.injector).withVerticalOrientation().withHomeAndEnd().withWrap(false);

  constructor() {
    effect(() => {
      const step = this.selectedStep();
      this.highlightChange.emit(step ? { paths: step.seam.paths, marks: step.marks } : null);
    });
  }

  protected toggle(): void {
    this.open.update((o) => !o);
    if (!this.open()) this.selectedStepId.set(null);
  }

  protected pressOptions(step: ResolvedJoinStep) {
    return joinPressOptions(step);
  }

  protected problemKind(kind: string): string {
    return joiningProblemKindText(kind);
  }

  protected pressValue(step: ResolvedJoinStep) {
    return joinPressValue(step);
  }

  /** Chooses a join (again: lets it go), so the board points at its seam. */
  protected select(step: ResolvedJoinStep): void {
    this.selectedStepId.update((id) => (id === step.id ? null : step.id));
  }

  /** Chooses the join a problem is about. */
  protected showProblem(stepId: string | null): void {
    if (stepId) this.selectedStepId.set(stepId);
  }

  protected adopt(): void {
    this.session.apply('Use joining plan', (d) => adoptDefaultJoiningPlan(d));
    this.announcer.announce('The proposed joining plan is now yours to change.');
  }

  protected reset(): void {
    this.session.apply('Proposed joining plan', (d) => resetJoiningPlan(d));
    this.announcer.announce('The joining plan is the proposed one again.');
  }

  /** Moves a join one place; focus stays with the control that moved it. */
  protected move(step: ResolvedJoinStep, delta: -1 | 1, focus: 'step' | 'up' | 'down' = delta < 0 ? 'up' : 'down'): void {
    if (this.ro()) return;
    const problem = joiningStepMoveProblem(this.session.document(), step.id, delta);
    this.moveProblem.set(problem ? `Join ${step.number} cannot move ${delta < 0 ? 'up' : 'down'}: ${problem}` : null);
    if (problem) {
      this.announcer.announce(this.moveProblem()!);
      return;
    }
    this.session.apply(delta < 0 ? 'Move join up' : 'Move join down', (d) => moveJoiningStep(d, step.id, delta));
    const now = step.number + delta;
    this.announcer.announce(`${step.label}: now join ${now} of ${this.plan()?.steps.length ?? now}`);
    this.refocus(step.id, focus);
  }

  protected setPress(step: ResolvedJoinStep, press: RingPress | JoinPress): void {
    this.session.apply('Join pressing', (d) => setJoiningStepPress(d, step.id, press));
  }

  /** ↑/↓/Home/End move between joins; Alt+↑/↓ move the focused join itself. */
  protected onListKey(e: KeyboardEvent, step: ResolvedJoinStep): void {
    if (e.altKey && (e.key === 'ArrowUp' || e.key === 'ArrowDown')) {
      e.preventDefault();
      this.move(step, e.key === 'ArrowUp' ? -1 : 1, 'step');
      return;
    }
    if (['ArrowUp', 'ArrowDown', 'Home', 'End'].includes(e.key) && !e.ctrlKey && !e.metaKey && !e.altKey && !e.shiftKey) {
      const index = this.stepButtons().findIndex((b) => b.stepId() === step.id);
      this.keys.updateActiveItem(index);
      this.keys.onKeydown(e);
      e.preventDefault();
    }
  }

  /** After the list is drawn again, gives focus back to the moved join's control (moving a node drops its focus). */
  private refocus(stepId: string, control: 'step' | 'up' | 'down'): void {
    afterNextRender(
      () => {
        const item = [...this.host.nativeElement.querySelectorAll('[data-step-id]')].find((li) => li.getAttribute('data-step-id') === stepId);
        const wanted = control === 'step' ? null : item?.querySelector<HTMLButtonElement>(`[data-move="${control}"]:not([disabled]):not([aria-disabled="true"])`);
        (wanted ?? item?.querySelector<HTMLButtonElement>('button.name'))?.focus();
      },
      { injector: this.injector },
    );
  }
}
