import { degToRad, distance, pointOnCircle, type Point } from '@seamwright/piecing';
import { deleteSection, findSection, moveSection, moveSectionHandle } from '../commands/section-commands';
import { angleTo, sectionHandles, sweepTo, type SectionHandle } from '../commands/section-handles';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

type SelectState =
  | { name: 'idle' }
  | { name: 'pressing'; sectionId: string; start: Point }
  | { name: 'dragging-section'; sectionId: string; start: Point; applied: Point }
  | { name: 'dragging-handle'; sectionId: string; handle: SectionHandle };

/**
 * Select / move: click a section (or one of its patches) to select it; drag it to move it; drag a
 * handle of the selected section (vertex, centre, radius, angle) to reshape it. A whole drag is one
 * undo step.
 */
export class SelectTool implements BoardTool {
  readonly id = 'select' as const;
  private s: SelectState = { name: 'idle' };

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.s.name;
  }

  get hint(): string {
    return this.s.name === 'idle' ? 'Click a section to select it, drag to move it, drag a handle to reshape it' : 'Release to finish';
  }

  pointerDown(e: ToolPointer): void {
    const { store, analysis } = this.ctx;
    const selected = store.selection.sectionId ? findSection(store.document, store.selection.sectionId) : undefined;
    if (selected) {
      const r = this.ctx.hitRadiusIn();
      const handle = sectionHandles(selected.geometry).find((h) => distance(h.point, e.point) <= r);
      if (handle) {
        store.beginGesture('Move point', selected.id);
        this.s = { name: 'dragging-handle', sectionId: selected.id, handle };
        return;
      }
    }
    const hit = analysis.sectionAt(store.document, e.point);
    if (!hit) {
      store.select({ sectionId: null, patchIndex: null });
      this.s = { name: 'idle' };
      return;
    }
    const patch = analysis.patchAt(hit, e.point);
    store.select({ sectionId: hit.id, patchIndex: patch ? patch.index : null });
    this.s = { name: 'pressing', sectionId: hit.id, start: e.point };
  }

  pointerMove(e: ToolPointer): void {
    const { store } = this.ctx;
    const s = this.s;
    if (s.name === 'pressing') {
      if (distance(e.point, s.start) < this.ctx.hitRadiusIn() / 2) return;
      store.beginGesture('Move section', s.sectionId);
      this.s = { name: 'dragging-section', sectionId: s.sectionId, start: s.start, applied: { x: 0, y: 0 } };
      this.pointerMove(e);
      return;
    }
    if (s.name === 'dragging-section') {
      const raw = { x: e.point.x - s.start.x, y: e.point.y - s.start.y };
      const delta = this.ctx.snapGrid(raw);
      const dx = delta.x - s.applied.x;
      const dy = delta.y - s.applied.y;
      if (dx !== 0 || dy !== 0) store.apply('Move section', (d) => moveSection(d, s.sectionId, dx, dy));
      s.applied = delta;
      return;
    }
    if (s.name === 'dragging-handle') {
      const snapped = this.snapAngles(s.sectionId, s.handle, this.ctx.snap(e.point, { excludeSectionId: s.sectionId }).point);
      store.apply('Move point', (d) => moveSectionHandle(d, s.sectionId, s.handle, snapped, this.ctx.analysis));
    }
  }

  pointerUp(e: ToolPointer): void {
    if (this.s.name === 'dragging-section' || this.s.name === 'dragging-handle') {
      this.pointerMove(e);
      this.ctx.store.endGesture();
    }
    this.s = { name: 'idle' };
  }

  key(key: string): boolean {
    const { store } = this.ctx;
    if (key === 'Escape') {
      if (this.s.name !== 'idle') this.cancel();
      else store.select({ sectionId: null, patchIndex: null });
      return true;
    }
    if ((key === 'Delete' || key === 'Backspace') && store.selection.sectionId && this.s.name === 'idle') {
      const id = store.selection.sectionId;
      store.apply('Delete section', (d) => deleteSection(d, id));
      store.select({ sectionId: null, patchIndex: null });
      return true;
    }
    return false;
  }

  cancel(): void {
    if (this.ctx.store.inGesture) this.ctx.store.cancelGesture();
    this.s = { name: 'idle' };
  }

  preview(): ToolPreview | null {
    return null;
  }

  /** A start or end handle's point moved so its angle (start) or the sweep (end) snaps, at the same distance from the centre. */
  private snapAngles(sectionId: string, handle: SectionHandle, p: Point): Point {
    const g = findSection(this.ctx.store.document, sectionId)?.geometry;
    if (!g || g.kind === 'straight' || (handle.kind !== 'start' && handle.kind !== 'end')) return p;
    const r = distance(g.centre, p);
    if (r === 0) return p;
    const deg =
      handle.kind === 'start'
        ? this.ctx.snapAngle(angleTo(g.centre, p), g.centre, 'direction')
        : g.startAngleDeg + this.ctx.snapAngle(sweepTo(g.centre, g.startAngleDeg, p), g.centre, 'sweep');
    return pointOnCircle(g.centre, r, degToRad(deg));
  }
}
