import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatTableModule } from '@angular/material/table';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { YARDAGE_STEP_IN, buildCuttingList, quiltPlan, type QuiltPlan, formatInches, stripSetDisplayName, type CuttingList } from '@seamwright/piecing';
import { PatternContext } from '../pattern-context.service';
import { CautionsComponent } from '../../shared/cautions.component';
import { StripDiagramComponent } from './strip-diagram.component';
import { showInches } from '../../core/length-text';
import { QuiltChoice } from '../quilt/quilt-choice.service';
import { QuiltChoiceBarComponent, chosenSize, documentInChoice } from '../quilt/quilt-choice-bar.component';
import { QuiltFabricNeedsComponent } from '../quilt/quilt-fabric-needs.component';

/** Yards as bought, from eighths of a yard: 5 → "⅝ yd", 11 → "1 ⅜ yd". */
export function formatYards(eighths: number): string {
  return `${formatInches(eighths / 8, { style: 'unicode', denominator: 8, withUnit: false })} yd`;
}

/** The cutting list: per fabric, pieces, strips, strip sets and yardage; printable. */
@Component({
  selector: 'sw-cutting-page',
  imports: [MatTableModule, MatButtonModule, MatIconModule, CautionsComponent, StripDiagramComponent, QuiltChoiceBarComponent, QuiltFabricNeedsComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './cutting-page.component.html',
  styleUrl: './cutting-page.component.scss',
})
export class CuttingPageComponent {
  protected readonly ctx = inject(PatternContext);
  protected readonly inches = showInches;
  protected readonly yards = formatYards;
  protected readonly choice = inject(QuiltChoice, { optional: true });
  /** The pattern in the colourway (or the user's own copy of one) chosen on the Quilt tab, cutting page or print page. */
  protected readonly document = computed(() => {
    const doc = this.ctx.document();
    return doc ? documentInChoice(doc, this.choice?.colourwayId() ?? null, this.choice?.copy() ?? null) : null;
  });
  /** The whole quilt in the chosen size and colourway, when the pattern is set into a quilt. */
  protected readonly quilt = computed<QuiltPlan | null>(() => {
    const doc = this.document();
    if (!doc?.quilt) return null;
    try {
      // The document is already in the chosen fabrics, so no colourway is applied again.
      return quiltPlan(doc, { sizeName: chosenSize(doc, this.choice?.sizeName() ?? null) });
    } catch {
      return null;
    }
  });
  protected readonly list = computed<CuttingList | { error: string } | null>(() => {
    const doc = this.document();
    if (!doc) return null;
    try {
      return buildCuttingList(doc);
    } catch (err) {
      return { error: err instanceof Error ? err.message : String(err) };
    }
  });
  protected readonly ok = computed(() => {
    const l = this.list();
    return l && !('error' in l) ? l : null;
  });
  protected readonly failure = computed(() => {
    const l = this.list();
    return l && 'error' in l ? l.error : null;
  });
  protected readonly usedFabrics = computed(() => (this.ok()?.fabrics ?? []).filter((f) => f.pieceCount > 0 || f.stripCount > 0));
  protected readonly unusedFabrics = computed(() =>
    (this.ok()?.fabrics ?? []).filter((f) => f.pieceCount === 0 && f.stripCount === 0).map((f) => f.name),
  );
  protected readonly fabricsById = computed(
    () => new Map((this.document()?.fabrics ?? []).map((f) => [f.id, { name: f.name, colour: f.colour }] as const)),
  );
  /** What quilters call each strip set of the list: its name, or the patches it fills; never its id. */
  protected readonly stripSetNames = computed(
    () => new Map((this.ok()?.stripSets ?? []).map((s) => [s.stripSetId, stripSetDisplayName(s.name, s.patchLabels)] as const)),
  );
  protected readonly pieceColumns = ['count', 'size', 'strips', 'patches'];
  protected readonly stripColumns = ['set', 'finished', 'cut', 'strips'];

  /** Eighths of a yard in a total that is already a sum of ⅛ yd (4 ½ in.) steps. */
  protected totalEighths(totalIn: number): number {
    return Math.round(totalIn / YARDAGE_STEP_IN);
  }

  protected fabricName(id: string): string {
    return this.fabricsById().get(id)?.name ?? id;
  }

  protected stripSetName(listId: string): string {
    return this.stripSetNames().get(listId) ?? 'Strip set';
  }

  protected print(): void {
    window.print();
  }
}
