import { distance, lerp, type Point } from '@seamwright/piecing';
import { addSeam } from '../commands/section-commands';
import type { BoardTool, ToolContext, ToolPointer, ToolPreview } from './tool';

/**
 * Split: press on a patch edge and drag across the patch to another edge; release to add the seam.
 * Both ends snap to edges (and vertices). The seam goes to the section under its midpoint.
 */
export class SplitTool implements BoardTool {
  readonly id = 'split' as const;
  private a: Point | null = null;
  private b: Point | null = null;
  private refused: string | null = null;

  constructor(private readonly ctx: ToolContext) {}

  get state(): string {
    return this.a ? 'drawing' : 'idle';
  }

  get hint(): string {
    if (this.a) return 'Drag across the patch and release on the far edge';
    return this.refused ?? 'Press on a patch edge to start a seam';
  }

  pointerDown(e: ToolPointer): void {
    this.refused = null;
    this.a = this.ctx.snap(e.point, { edges: true }).point;
    this.b = this.a;
  }

  pointerMove(e: ToolPointer): void {
    if (this.a) this.b = this.ctx.snap(e.point, { edges: true }).point;
  }

  pointerUp(e: ToolPointer): void {
    if (!this.a) return;
    this.b = this.ctx.snap(e.point, { edges: true }).point;
    const a = this.a;
    const b = this.b;
    this.a = this.b = null;
    const sectionId = this.targetSection(a, b);
    if (!sectionId) return;
    const { store, analysis } = this.ctx;
    const before = store.document.sections.find((s) => s.id === sectionId);
    const next = addSeam(store.document, sectionId, a, b, analysis);
    const after = next.sections.find((s) => s.id === sectionId);
    // A seam that splits nothing (it stops short of an edge, or runs along one) is not added.
    if (!before || !after || analysis.patches(after).length <= analysis.patches(before).length) {
      this.refused = 'That seam splits no patch: start and end it on patch edges, right across the patch';
      return;
    }
    this.refused = null;
    store.apply('Split patch', () => next);
    store.select({ sectionId, patchIndex: null });
  }

  key(key: string): boolean {
    if (key === 'Escape') {
      this.cancel();
      return true;
    }
    return false;
  }

  cancel(): void {
    this.a = this.b = null;
  }

  preview(): ToolPreview | null {
    if (!this.a || !this.b) return null;
    return { kind: 'seam', a: this.a, b: this.b, valid: this.targetSection(this.a, this.b) !== null };
  }

  private targetSection(a: Point, b: Point): string | null {
    if (distance(a, b) < Math.max(1 / 32, this.ctx.hitRadiusIn())) return null;
    const mid = lerp(a, b, 0.5);
    // Seams go on the section as drawn, not on its ring-repeat copies.
    return this.ctx.analysis.sectionAt(this.ctx.store.document, mid, { copies: false })?.id ?? null;
  }
}
