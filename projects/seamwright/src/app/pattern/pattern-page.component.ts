import { ChangeDetectionStrategy, Component, effect, inject, input } from '@angular/core';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatTabsModule } from '@angular/material/tabs';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PatternContext } from './pattern-context.service';
import { NotFoundComponent } from '../not-found/not-found.component';
import { accessLabel } from '../patterns/access-label';
import { QuiltChoice } from './quilt/quilt-choice.service';

interface PartLink {
  path: string;
  label: string;
  icon: string;
  editorsOnly?: boolean;
  ownerOnly?: boolean;
}

const PARTS: PartLink[] = [
  { path: 'board', label: 'Drafting board', icon: 'draw' },
  { path: 'quilt', label: 'Quilt', icon: 'grid_view' },
  { path: 'cutting', label: 'Cutting list', icon: 'content_cut' },
  { path: 'print', label: 'Print', icon: 'print' },
  { path: 'sew', label: 'Guided sewing', icon: 'play_circle' },
  { path: 'sewing-log', label: 'Sewing log', icon: 'checklist' },
  { path: 'history', label: 'History', icon: 'history' },
  { path: 'share', label: 'Share', icon: 'group', ownerOnly: true },
];

/** The pattern page: title, access, and links to its parts, each a child route. */
@Component({
  selector: 'sw-pattern-page',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatTabsModule, MatIconModule, MatProgressBarModule, NotFoundComponent],
  providers: [PatternContext, QuiltChoice],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (ctx.state.notFound()) {
      <sw-not-found />
    } @else {
      @if (ctx.state.loading() && !ctx.detail()) { <mat-progress-bar mode="indeterminate" aria-label="Loading the pattern" /> }
      @if (ctx.detail(); as d) {
        <header class="head">
          <h1>{{ ctx.title() }}</h1>
          <span class="meta sw-muted">
            {{ accessLabel(d.pattern.access) }} · revision {{ ctx.revision() }}
            @if (d.pattern.access !== 'owner') { · by {{ d.pattern.owner.displayName }} }
            @if (!ctx.canEdit()) { · <span class="ro">read-only</span> }
          </span>
        </header>
        <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Parts of the pattern" class="sw-no-print" mat-stretch-tabs="false">
          @for (part of parts(); track part.path) {
            <a mat-tab-link [routerLink]="part.path" routerLinkActive #rla="routerLinkActive" [active]="rla.isActive">
              <mat-icon aria-hidden="true" class="tab-icon">{{ part.icon }}</mat-icon>{{ part.label }}
            </a>
          }
        </nav>
        <mat-tab-nav-panel #panel class="panel"><router-outlet /></mat-tab-nav-panel>
      } @else if (ctx.state.error(); as e) {
        <p role="alert">The pattern could not be loaded: {{ e.message }}</p>
      }
    }
  `,
  styles: `
    .head { display: flex; flex-wrap: wrap; align-items: baseline; gap: 4px 16px; }
    .head h1 { margin-bottom: 4px; }
    .ro { font-weight: 500; }
    .tab-icon { margin-right: 8px; }
    .panel { display: block; padding-top: 16px; }
    @media (max-width: 840px) { .tab-icon { display: none; } }
  `,
})
export class PatternPageComponent {
  /** The pattern's id, from the URL. */
  readonly patternId = input.required<string>();
  protected readonly ctx = inject(PatternContext);
  protected readonly accessLabel = accessLabel;
  protected readonly parts = () => PARTS.filter((p) => (!p.ownerOnly || this.ctx.isOwner()) && (!p.editorsOnly || this.ctx.canEdit()));

  constructor() {
    effect(() => this.ctx.load(this.patternId()));
  }
}
