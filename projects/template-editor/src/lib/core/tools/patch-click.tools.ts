import { distanceToSegment } from '@seamwright/piecing';
import { deleteSeam, deleteSection, makeStripSet, setPatchFabric, setPatchStripSet } from '../commands/section-commands';
import type { BoardTool, ToolContext, ToolId, ToolPointer, ToolPreview } from './tool';

/** A tool that acts on one click and has no other state. */
abstract class ClickTool implements BoardTool {
  abstract readonly id: ToolId;
  abstract readonly hint: string;
  readonly state = 'idle';

  constructor(protected readonly ctx: ToolContext) {}

  abstract pointerDown(e: ToolPointer): void;
  pointerMove(): void {}
  pointerUp(): void {}
  key(key: string): boolean {
    return key === 'Escape';
  }
  cancel(): void {}
  preview(): ToolPreview | null {
    return null;
  }

  protected patchAt(e: ToolPointer) {
    const { store, analysis } = this.ctx;
    const section = analysis.sectionAt(store.document, e.point);
    const patch = section ? analysis.patchAt(section, e.point) : null;
    return section && patch ? { section, patch } : null;
  }
}

/** Fabric fill: click a patch to fill it with the chosen fabric; Alt-click clears it. */
export class FabricFillTool extends ClickTool {
  readonly id = 'fill' as const;
  readonly hint = 'Click a patch to fill it with the chosen fabric (Alt-click clears)';

  pointerDown(e: ToolPointer): void {
    const hit = this.patchAt(e);
    const fabricId = e.altKey ? undefined : this.ctx.activeFabricId() ?? undefined;
    if (!hit || (!fabricId && !e.altKey)) return;
    const analysis = this.ctx.analysis;
    this.ctx.store.apply('Fill patch', (d) => setPatchFabric(d, hit.section.id, hit.patch.index, fabricId, analysis));
    this.ctx.store.select({ sectionId: hit.section.id, patchIndex: hit.patch.index });
  }
}

/**
 * Strip set: click a patch to cover it with a strip set of the chosen widths, starting with the
 * chosen fabric and taking the pattern's next fabrics in turn; Alt-click removes it.
 */
export class StripSetTool extends ClickTool {
  readonly id = 'strip-set' as const;
  readonly hint = 'Click a patch to put a strip set on it (Alt-click removes it)';

  pointerDown(e: ToolPointer): void {
    const hit = this.patchAt(e);
    if (!hit) return;
    const doc = this.ctx.store.document;
    const analysis = this.ctx.analysis;
    if (e.altKey) {
      this.ctx.store.apply('Remove strip set', (d) => setPatchStripSet(d, hit.section.id, hit.patch.index, undefined, analysis));
      return;
    }
    const widths = this.ctx.stripWidthsIn();
    if (doc.fabrics.length === 0 || widths.length < 2) return;
    const first = Math.max(0, doc.fabrics.findIndex((f) => f.id === this.ctx.activeFabricId()));
    const fabrics = [...doc.fabrics.slice(first), ...doc.fabrics.slice(0, first)];
    const stripSet = makeStripSet(fabrics, widths);
    this.ctx.store.apply('Add strip set', (d) => setPatchStripSet(d, hit.section.id, hit.patch.index, stripSet, analysis));
    this.ctx.store.select({ sectionId: hit.section.id, patchIndex: hit.patch.index });
  }
}

/** Delete: click a seam to remove it (its two patches join), or a section to remove the section. */
export class DeleteTool extends ClickTool {
  readonly id = 'delete' as const;
  readonly hint = 'Click a seam or a section to delete it';

  pointerDown(e: ToolPointer): void {
    const { store, analysis } = this.ctx;
    // Only the section as drawn: a click on a ring-repeat copy must not delete by accident.
    const section = analysis.sectionAt(store.document, e.point, { copies: false });
    if (!section) return;
    const r = this.ctx.hitRadiusIn();
    const seam = section.seams.find((m) => distanceToSegment(e.point, m.a, m.b) <= r);
    if (seam) {
      store.apply('Delete seam', (d) => deleteSeam(d, section.id, seam.id, analysis));
      return;
    }
    store.apply('Delete section', (d) => deleteSection(d, section.id));
    if (store.selection.sectionId === section.id) store.select({ sectionId: null, patchIndex: null });
  }
}
