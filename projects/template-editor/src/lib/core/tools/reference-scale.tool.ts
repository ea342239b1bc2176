import type { Point } from '@seamwright/piecing';
import { scaleReferenceImage } from '../commands/reference-image';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

/** Id of the trace-image scale tool (to be listed in {@link ToolId}). */
export const REFERENCE_SCALE_TOOL = 'reference-scale' as const;

/**
 * Trace-image scale: click two points on the traced image whose true distance you know (the ends of a
 * ruler in the photo, two corners of a printed block), then type that distance; the image is scaled
 * about the first point ({@link scaleReferenceImage}), one undo step. States: idle (no point yet) →
 * second (first point placed) → measured (both placed, waiting for the distance). Escape starts over.
 * The points are where the pointer was, not snapped: they belong to the picture, not to the drawing.
 */
export class ReferenceScaleTool implements Omit<BoardTool, 'id'> {
  readonly id = REFERENCE_SCALE_TOOL;
  private first: Point | null = null;
  private second: Point | null = null;
  private pointer: Point | null = null;

  constructor(private readonly ctx: Pick<ToolContext, 'store'>) {}

  get state(): 'idle' | 'second' | 'measured' {
    return this.second ? 'measured' : this.first ? 'second' : 'idle';
  }

  get hint(): string {
    switch (this.state) {
      case 'idle':
        return 'Click a point on the traced image whose distance to another you know';
      case 'second':
        return 'Click the second point';
      case 'measured':
        return 'Type the true distance between the two points';
    }
  }

  /** The two picked points, once both are placed. */
  get points(): { p: Point; q: Point } | null {
    return this.first && this.second ? { p: this.first, q: this.second } : null;
  }

  /** Distance between the picked points as the image shows them now, inches (null until both are placed). */
  get shownDistanceIn(): number | null {
    const pts = this.points;
    return pts ? Math.hypot(pts.q.x - pts.p.x, pts.q.y - pts.p.y) : null;
  }

  pointerDown(e: ToolPointer): void {
    if (!this.ctx.store.document.referenceImage) return;
    if (this.state === 'idle' || this.state === 'measured') {
      this.first = e.point;
      this.second = null;
    } else if (Math.hypot(e.point.x - this.first!.x, e.point.y - this.first!.y) > 0) {
      this.second = e.point;
    }
    this.pointer = e.point;
  }

  pointerMove(e: ToolPointer): void {
    this.pointer = e.point;
  }

  pointerUp(_e?: ToolPointer): void {}

  key(key: string): boolean {
    if (key !== 'Escape' || this.state === 'idle') return false;
    this.cancel();
    return true;
  }

  /**
   * Scales the image so the picked points are `distanceIn` apart (one undo step), then waits for new
   * points. Returns whether the image changed.
   */
  applyDistance(distanceIn: number): boolean {
    const pts = this.points;
    if (!pts) return false;
    const before = this.ctx.store.document;
    this.ctx.store.apply('Scale trace image', (d) => scaleReferenceImage(d, pts.p, pts.q, distanceIn));
    const changed = this.ctx.store.document !== before;
    if (changed) this.cancel();
    return changed;
  }

  cancel(): void {
    this.first = null;
    this.second = null;
  }

  preview(): ToolPreview | null {
    if (!this.first) return null;
    const end = this.second ?? this.pointer;
    if (!end || end === this.first) return { kind: 'marker', point: this.first, label: '1' };
    return { kind: 'polyline', points: [this.first, end], closed: false };
  }
}
