import { distance, type Point } from '@seamwright/piecing';
import { followRingEdges } from '../commands/ring-edges';
import { addDrawnSection } from './add-drawn-section';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

/**
 * Straight section: click the vertices one by one; click the first vertex again (or press Enter) to
 * close the outline. Backspace takes back the last vertex, Escape drops the outline. With snapping to
 * points on, an edge whose corners sit on a ring and cut through it follows the ring's circle.
 */
export class StraightSectionTool implements BoardTool {
  readonly id = 'straight' as const;
  private points: Point[] = [];
  private cursor: Point | null = null;

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.points.length === 0 ? 'idle' : 'placing';
  }

  get hint(): string {
    return this.points.length < 3
      ? 'Click the corners of the section'
      : 'Click the first corner or press Enter to close the section';
  }

  /** The vertices placed so far. */
  get placed(): readonly Point[] {
    return this.points;
  }

  pointerDown(e: ToolPointer): void {
    const p = this.ctx.snap(e.point).point;
    if (this.points.length >= 3) {
      const first = this.points[0];
      if (distance(p, first) <= this.ctx.hitRadiusIn()) {
        this.commit();
        return;
      }
    }
    const last = this.points[this.points.length - 1];
    if (last && distance(p, last) < 1e-9) return;
    this.points.push(p);
    this.cursor = p;
  }

  pointerMove(e: ToolPointer): void {
    this.cursor = this.ctx.snap(e.point).point;
  }

  pointerUp(): void {}

  key(key: string): boolean {
    if (key === 'Enter') {
      if (this.points.length >= 3) this.commit();
      return true;
    }
    if (key === 'Backspace' && this.points.length > 0) {
      this.points.pop();
      return true;
    }
    if (key === 'Escape') {
      this.cancel();
      return true;
    }
    return false;
  }

  cancel(): void {
    this.points = [];
    this.cursor = null;
  }

  preview(): ToolPreview | null {
    if (this.points.length === 0) return null;
    const points = this.cursor ? [...this.points, this.cursor] : [...this.points];
    return { kind: 'polyline', points, closed: false };
  }

  private commit(): void {
    const vertices = this.points.map((p) => ({ x: p.x, y: p.y }));
    this.points = [];
    this.cursor = null;
    const drawn = { kind: 'straight' as const, vertices };
    // Corners snapped onto a ring: the edge between them follows the ring's circle exactly.
    const geometry = this.ctx.snapsToPoints() ? followRingEdges(this.ctx.store.document, drawn) : drawn;
    addDrawnSection(this.ctx, 'Add straight section', geometry);
  }
}
