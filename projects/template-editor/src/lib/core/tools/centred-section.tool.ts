import { degToRad, distance, pointOnCircle, type Point, type SectionGeometry } from '@seamwright/piecing';
import { angleTo, sweepTo } from '../commands/section-handles';
import type { BoardTool, ToolContext, ToolId, ToolPointer, ToolPreview } from './tool';

/**
 * The gesture arc and wedge sections start with: press at the centre and drag out to the (outer)
 * radius, the drag direction being the start angle; release (or click) there. What follows (inner
 * radius, end angle) is the subclass's: {@link laterDown}, {@link laterTrack}.
 */
export abstract class CentredSectionTool<Stage extends string> implements BoardTool {
  abstract readonly id: ToolId;
  abstract readonly hint: string;
  protected stage: 'idle' | Stage = 'idle';
  protected centre: Point = { x: 0, y: 0 };
  /** The radius dragged out first (a wedge's radius, an arc's outer radius). */
  protected radius = 0;
  protected start = 0;
  private dragged = false;

  /**
   * @param radialStage the stage while the radius is dragged out
   * @param nextStage the stage once the radius is set
   */
  constructor(
    protected readonly ctx: ToolContext,
    private readonly radialStage: Stage,
    private readonly nextStage: Stage,
  ) {}

  get state(): string {
    return this.stage;
  }

  pointerDown(e: ToolPointer): void {
    const p = this.ctx.snap(e.point).point;
    if (this.stage === 'idle') {
      this.centre = p;
      this.radius = 0;
      this.dragged = false;
      this.stage = this.radialStage;
    } else if (this.stage === this.radialStage) {
      this.setRadius(p);
    } else {
      this.laterDown(p);
    }
  }

  pointerMove(e: ToolPointer): void {
    if (this.stage === 'idle') return;
    this.dragged = true;
    this.track(this.ctx.snap(e.point).point);
  }

  pointerUp(e: ToolPointer): void {
    if (this.stage === this.radialStage && this.dragged) this.setRadius(this.ctx.snap(e.point).point);
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
    if (this.stage === this.radialStage) return { kind: 'polyline', points: [this.centre, pointOnCircle(this.centre, this.radius, degToRad(this.start))], closed: false };
    return { kind: 'geometry', geometry: this.geometry() };
  }

  /** The section as drawn so far. */
  protected abstract geometry(): SectionGeometry;

  /** The smallest radius that ends the drag-out. */
  protected abstract minRadius(): number;

  /** A press after the radius is set, at the snapped point `p`. */
  protected abstract laterDown(p: Point): void;

  /** Follows the pointer after the radius is set. */
  protected abstract laterTrack(p: Point): void;

  /** Called as the drag-out radius changes (an arc keeps its inner radius at half of it). */
  protected radiusChanged(): void {}

  /** The sweep from the start angle round to the direction of `p`, in (0, 360], snapped when angle snapping is on. */
  protected sweepTo(p: Point): number {
    return this.ctx.snapAngle(sweepTo(this.centre, this.start, p), this.centre, 'sweep');
  }

  private setRadius(p: Point): void {
    this.track(p);
    if (this.radius > this.minRadius()) this.stage = this.nextStage;
  }

  private track(p: Point): void {
    if (this.stage !== this.radialStage) {
      this.laterTrack(p);
      return;
    }
    this.radius = distance(this.centre, p);
    this.start = this.ctx.snapAngle(angleTo(this.centre, p), this.centre, 'direction');
    this.radiusChanged();
  }
}
