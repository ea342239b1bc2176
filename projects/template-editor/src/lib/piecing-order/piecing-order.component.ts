import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { CdkDrag, CdkDragHandle, CdkDropList, moveItemInArray, type CdkDragDrop } from '@angular/cdk/drag-drop';
import { MatButtonModule } from '@angular/material/button';
import { formatInches, type Point } from '@seamwright/piecing';
import { setPiecingOrder, type BoardPatch } from '../core/public-api';
import { EditorSession } from '../session/editor-session';

/**
 * The piecing order of the selected section: its patches in sewing order, reordered by dragging
 * (CDK drag and drop) or with the Renumber tool on the board; the sewability check's verdict in words;
 * and one action that applies a sewable order or shows where to split the section.
 */
@Component({
  selector: 'sw-piecing-order',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [CdkDropList, CdkDrag, CdkDragHandle, MatButtonModule],
  templateUrl: './piecing-order.component.html',
  styleUrl: './piecing-order.component.scss',
})
export class PiecingOrderComponent {
  protected readonly session = inject(EditorSession);
  protected readonly section = this.session.selectedSection;
  protected readonly ordered = computed(() => [...this.session.selectedPatches()].sort((a, b) => a.number - b.number));
  protected readonly sewability = this.session.selectedSewability;
  protected readonly fabricName = computed(() => new Map(this.session.document().fabrics.map((f) => [f.id, f])));
  protected readonly search = computed(() => {
    const last = this.session.lastOrderSearch();
    const s = this.section();
    return last && s && last.sectionId === s.id ? last.result : null;
  });

  protected drop(e: CdkDragDrop<BoardPatch[]>): void {
    const s = this.section();
    if (!s || e.previousIndex === e.currentIndex || this.session.readOnly()) return;
    const list = [...this.ordered()];
    moveItemInArray(list, e.previousIndex, e.currentIndex);
    this.session.apply('Reorder patches', (d) => setPiecingOrder(d, s.id, list.map((p) => p.index), this.session.editor.analysis));
  }

  protected move(p: BoardPatch, by: -1 | 1): void {
    const list = [...this.ordered()];
    const from = list.indexOf(p);
    const to = from + by;
    if (to < 0 || to >= list.length) return;
    this.drop({ previousIndex: from, currentIndex: to } as CdkDragDrop<BoardPatch[]>);
  }

  protected findOrder(): void {
    this.session.applySewableOrder();
  }

  protected point(p: Point): string {
    return `(${formatInches(p.x, { style: 'unicode', withUnit: false })}, ${formatInches(p.y, { style: 'unicode', withUnit: false })})`;
  }
}
