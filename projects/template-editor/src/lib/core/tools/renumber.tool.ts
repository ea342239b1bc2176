import { findSection, setPiecingOrder } from '../commands/section-commands';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

/**
 * Renumber: click the patches of a section in the order they are sewn. The numbers change as you
 * click; the whole sequence is one undo step. It ends when every patch is clicked, on Enter, or on a
 * click in another section; Escape puts the old numbers back.
 */
export class RenumberTool implements BoardTool {
  readonly id = 'renumber' as const;
  private sectionId: string | null = null;
  private order: number[] = [];

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.sectionId ? 'numbering' : 'idle';
  }

  get hint(): string {
    return this.sectionId ? `Click patch ${this.order.length + 1} (Enter to finish)` : 'Click the patches in sewing order, first one first';
  }

  /** Patch indices clicked so far. */
  get clicked(): readonly number[] {
    return this.order;
  }

  pointerDown(e: ToolPointer): void {
    const { store, analysis } = this.ctx;
    const section = analysis.sectionAt(store.document, e.point);
    if (!section) return;
    if (this.sectionId && section.id !== this.sectionId) this.finish();
    const patch = analysis.patchAt(section, e.point);
    if (!patch) return;
    if (!this.sectionId) {
      this.sectionId = section.id;
      this.order = [];
      store.beginGesture('Renumber patches', section.id);
      store.select({ sectionId: section.id, patchIndex: null });
    }
    if (this.order.includes(patch.index)) return;
    this.order.push(patch.index);
    const id = section.id;
    const order = [...this.order];
    store.apply('Renumber patches', (d) => setPiecingOrder(d, id, order, analysis));
    const s = findSection(store.document, id);
    if (s && this.order.length >= analysis.patches(s).length) this.finish();
  }

  pointerMove(): void {}
  pointerUp(): void {}

  key(key: string): boolean {
    if (key === 'Enter') {
      this.finish();
      return true;
    }
    if (key === 'Escape') {
      if (this.sectionId) this.ctx.store.cancelGesture();
      this.sectionId = null;
      this.order = [];
      return true;
    }
    return false;
  }

  /** Leaving the tool keeps the numbers clicked so far. */
  cancel(): void {
    this.finish();
  }

  preview(): ToolPreview | null {
    return null;
  }

  private finish(): void {
    if (this.sectionId) this.ctx.store.endGesture();
    this.sectionId = null;
    this.order = [];
  }
}
