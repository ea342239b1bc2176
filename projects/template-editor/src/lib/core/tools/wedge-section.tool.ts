import { degToRad, distance, normaliseAngleDeg, pointOnCircle, wedgeGeometrySchema, type Point, type WedgeGeometry } from '@seamwright/piecing';
import { angleTo } from '../commands/section-handles';
import { addDrawnSection, parseTypedGeometry, type TypedResult } from './add-drawn-section';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

type WedgeStage = 'idle' | 'radius' | 'sweep';

/** The numbers of a wedge section as typed into the board. */
export type TypedWedge = Omit<WedgeGeometry, 'kind'>;

/**
 * Wedge section: press at the centre and drag out to the radius (the drag direction is the start
 * angle), release; move round to the end angle and click. Or type the numbers.
 */
export class WedgeSectionTool implements BoardTool {
  readonly id = 'wedge' as const;
  private stage: WedgeStage = 'idle';
  private centre: Point = { x: 0, y: 0 };
  private radius = 0;
  private start = 0;
  private sweep = 45;
  private dragged = false;

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.stage;
  }

  get hint(): string {
    return this.stage === 'idle'
      ? 'Press at the centre and drag out to the radius'
      : this.stage === 'radius'
        ? 'Release (or click) at the radius; the direction is the start angle'
        : 'Click at the end angle';
  }

  pointerDown(e: ToolPointer): void {
    const p = this.ctx.snap(e.point).point;
    if (this.stage === 'idle') {
      this.centre = p;
      this.radius = 0;
      this.dragged = false;
      this.stage = 'radius';
    } else if (this.stage === 'radius') {
      this.track(p);
      if (this.radius > 1 / 16) this.stage = 'sweep';
    } else {
      this.track(p);
      this.commit();
    }
  }

  pointerMove(e: ToolPointer): void {
    if (this.stage === 'idle') return;
    this.dragged = true;
    this.track(this.ctx.snap(e.point).point);
  }

  pointerUp(e: ToolPointer): void {
    if (this.stage === 'radius' && this.dragged) {
      this.track(this.ctx.snap(e.point).point);
      if (this.radius > 1 / 16) this.stage = 'sweep';
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
    if (this.stage === 'idle' || this.radius <= 0) return null;
    if (this.stage === 'radius') return { kind: 'polyline', points: [this.centre, pointOnCircle(this.centre, this.radius, degToRad(this.start))], closed: false };
    return { kind: 'geometry', geometry: this.geometry() };
  }

  /** Adds a wedge section from typed numbers, or says what is wrong with them. */
  commitTyped(values: TypedWedge): TypedResult {
    const parsed = parseTypedGeometry(wedgeGeometrySchema, { kind: 'wedge', ...values });
    if (!parsed.ok) return parsed;
    this.stage = 'idle';
    return { ok: true, sectionId: addDrawnSection(this.ctx, 'Add wedge section', parsed.geometry) };
  }

  private track(p: Point): void {
    if (this.stage === 'radius') {
      this.radius = distance(this.centre, p);
      this.start = angleTo(this.centre, p);
    } else if (this.stage === 'sweep') {
      this.sweep = normaliseAngleDeg(angleTo(this.centre, p) - this.start) || 360;
    }
  }

  private geometry(): WedgeGeometry {
    return { kind: 'wedge', centre: { ...this.centre }, radiusIn: this.radius, startAngleDeg: this.start, sweepDeg: this.sweep };
  }

  private commit(): void {
    const g = this.geometry();
    this.stage = 'idle';
    if (wedgeGeometrySchema.safeParse(g).success) addDrawnSection(this.ctx, 'Add wedge section', g);
  }
}
