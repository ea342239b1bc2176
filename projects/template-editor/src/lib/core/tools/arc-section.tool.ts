import { arcGeometrySchema, degToRad, distance, pointOnCircle, normaliseAngleDeg, type ArcGeometry, type Point } from '@seamwright/piecing';
import { angleTo } from '../commands/section-handles';
import { addDrawnSection, parseTypedGeometry, type TypedResult } from './add-drawn-section';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

type ArcStage = 'idle' | 'outer' | 'inner' | 'sweep';

/** The numbers of an arc section as typed into the board. */
export type TypedArc = Omit<ArcGeometry, 'kind'>;

/**
 * Arc section: press at the centre and drag out to the outer radius (the drag direction is the start
 * angle), release; move in to the inner radius and click; move round to the end angle and click. Or
 * type the numbers ({@link ArcSectionTool.commitTyped}).
 */
export class ArcSectionTool implements BoardTool {
  readonly id = 'arc' as const;
  private stage: ArcStage = 'idle';
  private centre: Point = { x: 0, y: 0 };
  private outer = 0;
  private inner = 0;
  private start = 0;
  private sweep = 90;
  private dragged = false;

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.stage;
  }

  get hint(): string {
    switch (this.stage) {
      case 'idle':
        return 'Press at the centre and drag out to the outer radius';
      case 'outer':
        return 'Release (or click) at the outer radius; the direction is the start angle';
      case 'inner':
        return 'Click at the inner radius';
      case 'sweep':
        return 'Click at the end angle';
    }
  }

  pointerDown(e: ToolPointer): void {
    const p = this.ctx.snap(e.point).point;
    switch (this.stage) {
      case 'idle':
        this.centre = p;
        this.outer = 0;
        this.dragged = false;
        this.stage = 'outer';
        return;
      case 'outer':
        this.track(p);
        if (this.outer > this.minRadius()) this.stage = 'inner';
        return;
      case 'inner':
        this.track(p);
        this.stage = 'sweep';
        return;
      case 'sweep':
        this.track(p);
        this.commit();
        return;
    }
  }

  pointerMove(e: ToolPointer): void {
    if (this.stage === 'idle') return;
    this.dragged = true;
    this.track(this.ctx.snap(e.point).point);
  }

  pointerUp(e: ToolPointer): void {
    if (this.stage === 'outer' && this.dragged) {
      this.track(this.ctx.snap(e.point).point);
      if (this.outer > this.minRadius()) this.stage = 'inner';
    }
  }

  key(key: string): boolean {
    if (key === 'Escape') {
      this.cancel();
      return true;
    }
    return false;
  }

  cancel(): void {
    this.stage = 'idle';
  }

  preview(): ToolPreview | null {
    if (this.stage === 'idle' || this.outer <= 0) return null;
    if (this.stage === 'outer') return { kind: 'polyline', points: [this.centre, pointOnCircle(this.centre, this.outer, degToRad(this.start))], closed: false };
    return { kind: 'geometry', geometry: this.geometry() };
  }

  /**
   * Adds an arc section from typed numbers; returns the problem in words when they do not make one
   * (the document stays as it is).
   */
  commitTyped(values: TypedArc): TypedResult {
    const parsed = parseTypedGeometry(arcGeometrySchema, { kind: 'arc', ...values });
    if (!parsed.ok) return parsed;
    this.stage = 'idle';
    return { ok: true, sectionId: addDrawnSection(this.ctx, 'Add arc section', parsed.geometry) };
  }

  private minRadius(): number {
    return Math.max(1 / 16, this.ctx.hitRadiusIn() / 4);
  }

  private track(p: Point): void {
    const r = distance(this.centre, p);
    if (this.stage === 'outer') {
      this.outer = r;
      this.start = angleTo(this.centre, p);
      this.inner = r / 2;
    } else if (this.stage === 'inner') {
      this.inner = Math.min(this.outer - 1 / 16, Math.max(1 / 16, r));
    } else if (this.stage === 'sweep') {
      this.sweep = normaliseAngleDeg(angleTo(this.centre, p) - this.start) || 360;
    }
  }

  private geometry(): ArcGeometry {
    return {
      kind: 'arc',
      centre: { ...this.centre },
      innerRadiusIn: this.inner,
      outerRadiusIn: this.outer,
      startAngleDeg: this.start,
      sweepDeg: this.sweep,
    };
  }

  private commit(): void {
    const g = this.geometry();
    this.stage = 'idle';
    if (arcGeometrySchema.safeParse(g).success) addDrawnSection(this.ctx, 'Add arc section', g);
  }
}
