import { arcGeometrySchema, distance, type ArcGeometry, type Point } from '@seamwright/piecing';
import { addDrawnSection, parseTypedGeometry, type TypedResult } from './add-drawn-section';
import { CentredSectionTool } from './centred-section.tool';
import type { ToolContext } from './tool';

/** The numbers of an arc section as typed into the board. */
export type TypedArc = Omit<ArcGeometry, 'kind'>;

/**
 * Arc section: press at the centre and drag out to the outer radius (the drag direction is the start
 * angle), release; move in to the inner radius and click; move round to the end angle and click. Or
 * type the numbers ({@link ArcSectionTool.commitTyped}).
 */
export class ArcSectionTool extends CentredSectionTool<'outer' | 'inner' | 'sweep'> {
  readonly id = 'arc' as const;
  private inner = 0;
  private sweep = 90;

  constructor(ctx: ToolContext) {
    super(ctx, 'outer', 'inner');
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

  protected minRadius(): number {
    return Math.max(1 / 16, this.ctx.hitRadiusIn() / 4);
  }

  protected override radiusChanged(): void {
    this.inner = this.radius / 2;
  }

  protected laterTrack(p: Point): void {
    if (this.stage === 'inner') this.inner = Math.min(this.radius - 1 / 16, Math.max(1 / 16, distance(this.centre, p)));
    else if (this.stage === 'sweep') this.sweep = this.sweepTo(p);
  }

  protected laterDown(p: Point): void {
    this.laterTrack(p);
    if (this.stage === 'inner') {
      this.stage = 'sweep';
      return;
    }
    const g = this.geometry();
    this.stage = 'idle';
    if (arcGeometrySchema.safeParse(g).success) addDrawnSection(this.ctx, 'Add arc section', g);
  }

  protected geometry(): ArcGeometry {
    return {
      kind: 'arc',
      centre: { ...this.centre },
      innerRadiusIn: this.inner,
      outerRadiusIn: this.radius,
      startAngleDeg: this.start,
      sweepDeg: this.sweep,
    };
  }
}
