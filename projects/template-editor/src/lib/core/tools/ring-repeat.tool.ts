import type { Point } from '@seamwright/piecing';
import { findSection, setRingRepeat } from '../commands/section-commands';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

/**
 * Ring repeat: click a section, then click the centre of the ring (it snaps to circle centres; Enter
 * takes the section's own centre for arcs and wedges). The copies follow the original.
 */
export class RingRepeatTool implements BoardTool {
  readonly id = 'ring' as const;
  private sectionId: string | null = null;
  private cursor: Point | null = null;

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.sectionId ? 'choosing-centre' : 'idle';
  }

  get hint(): string {
    return this.sectionId ? 'Click the centre of the ring (Enter: the section’s own centre)' : 'Click the section to repeat around a centre';
  }

  pointerDown(e: ToolPointer): void {
    const { store, analysis } = this.ctx;
    if (!this.sectionId) {
      const hit = analysis.sectionAt(store.document, e.point);
      if (!hit) return;
      this.sectionId = hit.id;
      store.select({ sectionId: hit.id, patchIndex: null });
      return;
    }
    this.apply(this.ctx.snap(e.point).point);
  }

  pointerMove(e: ToolPointer): void {
    this.cursor = this.sectionId ? this.ctx.snap(e.point).point : null;
  }

  pointerUp(): void {}

  key(key: string): boolean {
    if (key === 'Escape') {
      this.cancel();
      return true;
    }
    if (key === 'Enter' && this.sectionId) {
      const s = findSection(this.ctx.store.document, this.sectionId);
      if (s && s.geometry.kind !== 'straight') this.apply(s.geometry.centre);
      return true;
    }
    return false;
  }

  cancel(): void {
    this.sectionId = null;
    this.cursor = null;
  }

  preview(): ToolPreview | null {
    return this.sectionId && this.cursor ? { kind: 'marker', point: this.cursor, label: `×${this.ctx.ringCount()}` } : null;
  }

  private apply(centre: Point): void {
    const id = this.sectionId;
    if (!id) return;
    const count = this.ctx.ringCount();
    this.ctx.store.apply('Ring repeat', (d) => setRingRepeat(d, id, { count, centre: { x: centre.x, y: centre.y } }));
    this.sectionId = null;
    this.cursor = null;
  }
}
