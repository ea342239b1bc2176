import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import type { BoardUnit, GridSnap, ToolId } from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { GRID_SNAP_CHOICES, TOOL_CATALOGUE } from './tool-catalogue';

/** The board's toolbar: tools, snapping, unit, view toggles, the colourway shown, fabric to fill with, undo and redo. */
@Component({
  selector: 'sw-board-toolbar',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatSelectModule, MatSlideToggleModule],
  templateUrl: './board-toolbar.component.html',
  styleUrl: './board-toolbar.component.scss',
})
export class BoardToolbarComponent {
  protected readonly session = inject(EditorSession);
  protected readonly tools = computed(() => TOOL_CATALOGUE.filter((t) => !t.edits || !this.session.readOnly()));
  protected readonly snaps = GRID_SNAP_CHOICES;
  /** The pattern's fabrics to fill with; while a colourway shows, each says what it shows as there. */
  protected readonly fabrics = computed(() => {
    const shown = this.session.shownColourway();
    return this.session.document().fabrics.map((f) => {
      const slot = shown?.fabrics[f.id];
      return { id: f.id, name: f.name, shownColour: slot?.colour ?? f.colour, shownAs: slot ? `${shown!.name}: ${slot.name}` : null };
    });
  });
  /** The pattern's colourways, each with its fabric colours for the swatches. */
  protected readonly colourways = computed(() =>
    (this.session.document().colourways ?? []).map((c) => ({ id: c.id, name: c.name, colours: Object.values(c.fabrics).map((f) => f.colour) })),
  );
  /** The colourway the board shows ('' for the pattern's own fabrics). */
  protected readonly shownColourwayId = computed(() => this.session.shownColourway()?.id ?? '');
  protected readonly activeFabric = computed(() => this.session.settings().activeFabricId ?? this.fabrics()[0]?.id ?? null);

  protected pickTool(id: ToolId): void {
    this.session.setTool(id);
  }

  protected setGrid(grid: GridSnap): void {
    this.session.setSettings({ grid });
  }

  protected setUnit(unit: BoardUnit): void {
    this.session.setSettings({ unit, grid: unit === 'cm' ? 'half-cm' : this.session.settings().grid === 'half-cm' ? 'eighth-in' : this.session.settings().grid });
  }

  /** Shows the board in a colourway ('' for the pattern's own fabrics): view state, no undo step. */
  protected setColourway(id: string): void {
    this.session.colourwayId.set(id || null);
  }

  protected setFabric(id: string): void {
    this.session.setSettings({ activeFabricId: id });
  }
}
