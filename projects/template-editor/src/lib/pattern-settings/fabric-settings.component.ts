import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { LiveAnnouncer } from '@angular/cdk/a11y';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MAX_SIZE_IN } from '@seamwright/piecing';
import { addFabric, fabricChangeProblem, fabricUses, newFabric, removeFabric, updateFabric, type FabricChange } from '../core/public-api';
import { NumberFieldComponent } from '../properties/number-field.component';
import { EditorSession } from '../session/editor-session';

/**
 * The pattern's fabrics: name, colour (the browser's colour picker), usable width of fabric; add one;
 * remove one no patch or strip uses (otherwise the button says which patches use it).
 */
@Component({
  selector: 'sw-fabric-settings',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, NumberFieldComponent],
  template: `
    @if (shownColourway(); as c) {
      <p class="shown-colourway" role="status" data-testid="fabrics-colourway-note">
        The board shows the colourway {{ c.name }}. These are the pattern's own fabrics: a change here changes the pattern, not {{ c.name }}.
      </p>
    }
    <p class="muted">Usable width: what is left of the width of fabric once the selvages are trimmed; strips are cut across it.</p>
    <ul class="fabrics" aria-label="Fabrics">
      @for (f of rows(); track f.id) {
        <li class="fabric" [attr.aria-label]="f.name">
          <div class="colour">
            <label [for]="'fabric-colour-' + f.id">Colour</label>
            <input type="color" [id]="'fabric-colour-' + f.id" [value]="f.colour" [disabled]="ro()" [attr.aria-label]="'Colour of ' + f.name" (change)="change(f.id, { colour: colourOf($event) })" />
          </div>
          <mat-form-field appearance="outline" subscriptSizing="dynamic" class="name">
            <mat-label>Name</mat-label>
            <input matInput #name [value]="f.name" maxlength="80" [readonly]="ro()" [attr.aria-label]="'Name of fabric ' + f.name" (change)="change(f.id, { name: name.value }, name)" (keydown.enter)="name.blur()" />
            @if (errors()[f.id]; as error) {
              <mat-hint class="error" role="alert">{{ error }}</mat-hint>
            }
          </mat-form-field>
          <sw-number-field class="wof" label="Usable width" [value]="f.usableWofIn" [unit]="unit()" [min]="1" [max]="maxWof" [readOnly]="ro()" (valueChange)="change(f.id, { usableWofIn: $event })" />
          @if (!ro()) {
            <div class="remove">
              <button
                mat-button
                type="button"
                [disabled]="f.uses.length > 0"
                [disabledInteractive]="true"
                [attr.aria-label]="'Remove fabric ' + f.name"
                [attr.aria-describedby]="f.uses.length ? 'fabric-uses-' + f.id : null"
                (click)="remove(f.id, f.name)"
              >
                Remove
              </button>
              @if (f.uses.length) {
                <span class="muted" [id]="'fabric-uses-' + f.id">In use by {{ f.usesText }}: fill those patches with another fabric first.</span>
              }
            </div>
          }
        </li>
      } @empty {
        <li class="muted">No fabrics yet.</li>
      }
    </ul>
    @if (!ro()) {
      <button mat-stroked-button type="button" (click)="add()" [disabled]="rows().length >= 100">Add fabric</button>
    }
  `,
  styles: `
    :host { display: block; }
    .fabrics { list-style: none; margin: 0 0 8px; padding: 0; }
    .fabric { display: grid; grid-template-columns: auto minmax(0, 1fr) 7rem; gap: 4px 8px; align-items: start; padding: 8px 0 4px; border-bottom: 1px solid var(--mat-sys-outline-variant); }
    .colour { display: flex; flex-direction: column; align-items: center; font: var(--mat-sys-label-small); color: var(--mat-sys-on-surface-variant); }
    .colour input { width: 40px; height: 32px; padding: 0; border: 1px solid var(--mat-sys-outline); border-radius: 4px; background: var(--mat-sys-surface); cursor: pointer; }
    .remove { grid-column: 2 / span 2; }
    .remove { display: flex; align-items: center; gap: 8px; flex-wrap: wrap; }
    .muted { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-small); }
    .shown-colourway {
      margin: 0 0 8px; padding: 8px; border-radius: 4px; font: var(--mat-sys-body-small);
      background: var(--mat-sys-secondary-container); color: var(--mat-sys-on-secondary-container);
    }
    .error { color: var(--mat-sys-error); }
    mat-form-field { width: 100%; }
  `,
})
export class FabricSettingsComponent {
  private readonly session = inject(EditorSession);
  private readonly announcer = inject(LiveAnnouncer);
  protected readonly ro = this.session.readOnly;
  protected readonly unit = computed(() => this.session.settings().unit);
  /** The colourway the board shows, if any (the fabrics edited here are still the pattern's own). */
  protected readonly shownColourway = this.session.shownColourway;
  protected readonly maxWof = MAX_SIZE_IN;
  /** What is wrong with the last typed change of each fabric, by fabric id. */
  protected readonly errors = signal<Record<string, string>>({});
  protected readonly rows = computed(() => {
    const doc = this.session.document();
    return doc.fabrics.map((f) => {
      const uses = fabricUses(doc, f.id);
      const shown = uses.slice(0, 6).join(', ');
      return { ...f, uses, usesText: uses.length > 6 ? `${shown} and ${uses.length - 6} more` : shown };
    });
  });

  protected colourOf(e: Event): string {
    return (e.target as HTMLInputElement).value;
  }

  protected change(fabricId: string, change: FabricChange, input?: HTMLInputElement): void {
    const problem = fabricChangeProblem(this.session.document(), fabricId, change);
    this.errors.update((all) => {
      const { [fabricId]: _old, ...rest } = all;
      return problem ? { ...rest, [fabricId]: problem } : rest;
    });
    if (problem) return;
    const label = change.name !== undefined ? 'Rename fabric' : change.colour !== undefined ? 'Fabric colour' : 'Usable width of fabric';
    this.session.apply(label, (d) => updateFabric(d, fabricId, change));
    // A name typed with spaces round it shows as kept.
    if (input && change.name !== undefined) input.value = change.name.trim();
  }

  protected add(): void {
    const fabric = newFabric(this.session.document());
    this.session.apply('Add fabric', (d) => addFabric(d, fabric));
    this.announcer.announce(`${fabric.name} added`);
  }

  protected remove(fabricId: string, name: string): void {
    if (fabricUses(this.session.document(), fabricId).length > 0) return;
    this.session.apply('Remove fabric', (d) => removeFabric(d, fabricId));
    this.announcer.announce(`${name} removed`);
  }
}
