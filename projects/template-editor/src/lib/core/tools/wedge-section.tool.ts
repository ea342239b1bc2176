import { wedgeGeometrySchema, type Point, type WedgeGeometry } from '@seamwright/piecing';
import { addDrawnSection, parseTypedGeometry, type TypedResult } from './add-drawn-section';
import { CentredSectionTool } from './centred-section.tool';
import type { ToolContext } from './tool';

/** The numbers of a wedge section as typed into the board. */
export type TypedWedge = Omit<WedgeGeometry, 'kind'>;

/**
 * Wedge section: press at the centre and drag out to the radius (the drag direction is the start
 * angle), release; move round to the end angle and click. Or type the numbers.
 */
export class WedgeSectionTool extends CentredSectionTool<'radius' | 'sweep'> {
  readonly id = 'wedge' as const;
  private sweep = 45;

  constructor(ctx: ToolContext) {
    super(ctx, 'radius', 'sweep');
  }

  get hint(): string {
    return this.stage === 'idle'
      ? 'Press at the centre and drag out to the radius'
      : this.stage === 'radius'
        ? 'Release (or click) at the radius; the direction is the start angle'
        : 'Click at the end angle';
  }

  /** Adds a wedge section from typed numbers, or says what is wrong with them. */
  commitTyped(values: TypedWedge): TypedResult {
    const parsed = parseTypedGeometry(wedgeGeometrySchema, { kind: 'wedge', ...values });
    if (!parsed.ok) return parsed;
    this.stage = 'idle';
    return { ok: true, sectionId: addDrawnSection(this.ctx, 'Add wedge section', parsed.geometry) };
  }

  protected minRadius(): number {
    return 1 / 16;
  }

  protected laterTrack(p: Point): void {
    this.sweep = this.sweepTo(p);
  }

  protected laterDown(p: Point): void {
    this.laterTrack(p);
    const g = this.geometry();
    this.stage = 'idle';
    if (wedgeGeometrySchema.safeParse(g).success) addDrawnSection(this.ctx, 'Add wedge section', g);
  }

  protected geometry(): WedgeGeometry {
    return { kind: 'wedge', centre: { ...this.centre }, radiusIn: this.radius, startAngleDeg: this.start, sweepDeg: this.sweep };
  }
}
