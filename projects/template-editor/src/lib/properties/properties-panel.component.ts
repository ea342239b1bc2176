import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { parseLength, sectionGeometrySchema, type Seam, type SeamPress, type SectionGeometry, type StripSet } from '@seamwright/piecing';
import {
  ArcSectionTool,
  WedgeSectionTool,
  makeStripSet,
  setPatchFabric,
  setPatchStripSet,
  setPatternSettings,
  setRingRepeat,
  setSectionGeometry,
  updateSectionDetails,
  setSeamEnd,
  seamPressingOf,
  setSeamPressing,
  setSectionNote,
} from '../core/public-api';
import { EditorSession } from '../session/editor-session';
import { NumberFieldComponent } from './number-field.component';
import { PatchCuttingComponent } from './patch-cutting.component';

/**
 * The properties panel: the selected section's numbers (centre, radii, angles, corners), its ring
 * repeat and label; the selected patch's fabric, strip set and cutting (rough cut, piece template); each seam's pressing; with nothing selected, the pattern's
 * seam allowance and drawing area, and with the arc or wedge tool, a form to type a new section.
 */
@Component({
  selector: 'sw-properties-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, NumberFieldComponent, PatchCuttingComponent],
  templateUrl: './properties-panel.component.html',
  styleUrl: './properties-panel.component.scss',
})
export class PropertiesPanelComponent {
  protected readonly session = inject(EditorSession);
  protected readonly unit = computed(() => this.session.settings().unit);
  protected readonly section = this.session.selectedSection;
  protected readonly ro = this.session.readOnly;
  protected readonly patch = computed(() => {
    const i = this.session.selection().patchIndex;
    return i === null ? null : this.session.selectedPatches()[i] ?? null;
  });
  protected readonly fabrics = computed(() => this.session.document().fabrics);
  /** Why the last geometry change was refused, in words. */
  protected readonly geometryError = signal<string | null>(null);
  protected readonly labelError = signal<string | null>(null);
  protected readonly stripError = signal<string | null>(null);
  protected readonly typedError = signal<string | null>(null);
  /** The numbers of the arc or wedge typed in the new-section form. */
  protected readonly typed = signal({ cx: 12, cy: 12, inner: 5, outer: 8, radius: 5, start: 0, sweep: 45 });
  protected readonly stripWidthsText = computed(() => {
    const s = this.patch()?.stripSet;
    return s ? s.strips.map((st) => String(st.finishedWidthIn)).join(', ') : this.session.settings().stripWidthsIn.join(', ');
  });

  protected changeGeometry(change: Record<string, unknown>): void {
    const s = this.section();
    if (!s) return;
    const next = { ...s.geometry, ...change } as SectionGeometry;
    const parsed = sectionGeometrySchema.safeParse(next);
    if (!parsed.success) {
      this.geometryError.set(parsed.error.issues.map((i) => i.message).join('; '));
      return;
    }
    this.geometryError.set(null);
    this.session.apply('Change section', (d) => setSectionGeometry(d, s.id, parsed.data, this.session.editor.analysis));
  }

  protected changeSeamEnd(seamId: string, end: 'a' | 'b', axis: 'x' | 'y', value: number): void {
    const s = this.section();
    const seam = s?.seams.find((m) => m.id === seamId);
    if (!s || !seam) return;
    const point = { ...seam[end], [axis]: value };
    this.session.apply('Move seam end', (d) => setSeamEnd(d, s.id, seamId, end, point, this.session.editor.analysis));
  }

  /** The ways a patch seam may be pressed, in words. */
  protected readonly seamPressings: ReadonlyArray<{ value: SeamPress; label: string }> = [
    { value: 'added', label: 'Toward the patch just added' },
    { value: 'previous', label: 'Toward the earlier patches' },
    { value: 'open', label: 'Open' },
  ];

  protected pressingOf(seam: Seam): SeamPress {
    return seamPressingOf(seam);
  }

  protected changeSeamPressing(seamId: string, press: SeamPress): void {
    const s = this.section();
    if (s) this.session.apply('Seam pressing', (d) => setSeamPressing(d, s.id, seamId, press));
  }

  protected changeCentre(axis: 'x' | 'y', value: number): void {
    const s = this.section();
    if (!s || s.geometry.kind === 'straight') return;
    this.changeGeometry({ centre: { ...s.geometry.centre, [axis]: value } });
  }

  protected changeVertex(index: number, axis: 'x' | 'y', value: number): void {
    const s = this.section();
    if (!s || s.geometry.kind !== 'straight') return;
    const vertices = s.geometry.vertices.slice();
    vertices[index] = { ...vertices[index], [axis]: value };
    this.changeGeometry({ vertices });
  }

  protected changeLabel(text: string): void {
    const s = this.section();
    const label = text.trim().toUpperCase();
    if (!s || label === s.label) return;
    if (!/^[A-Z]{1,3}$/.test(label)) return this.labelError.set('a section label is one to three capital letters');
    if (this.session.document().sections.some((o) => o.id !== s.id && o.label === label)) return this.labelError.set(`section ${label} exists already`);
    this.labelError.set(null);
    this.session.apply('Rename section', (d) => updateSectionDetails(d, s.id, { label }));
  }

  protected changeNote(note: string): void {
    const s = this.section();
    if (!s || (s.note ?? '') === note) return;
    this.session.apply('Change note', (d) => setSectionNote(d, s.id, note.slice(0, 500)));
  }

  protected changeRingCount(count: number): void {
    const s = this.section();
    if (!s) return;
    const centre = s.ringRepeat?.centre ?? (s.geometry.kind === 'straight' ? { x: this.session.document().canvas.widthIn / 2, y: this.session.document().canvas.heightIn / 2 } : s.geometry.centre);
    this.session.apply('Ring repeat', (d) => setRingRepeat(d, s.id, { count, centre }));
  }

  protected removeRing(): void {
    const s = this.section();
    if (s) this.session.apply('Remove ring repeat', (d) => setRingRepeat(d, s.id, undefined));
  }

  protected setFabric(fabricId: string | null): void {
    const s = this.section();
    const p = this.patch();
    if (!s || !p) return;
    this.session.apply('Fill patch', (d) => setPatchFabric(d, s.id, p.index, fabricId ?? undefined, this.session.editor.analysis));
  }

  protected applyStripSet(widthsText: string, angleDeg: number): void {
    const s = this.section();
    const p = this.patch();
    if (!s || !p) return;
    const widths: number[] = [];
    for (const part of widthsText.split(/[;,]/).map((t) => t.trim()).filter(Boolean)) {
      const r = parseLength(part, this.unit());
      if (!r.ok) return this.stripError.set(`${part}: ${r.message}`);
      if (r.inches <= 0) return this.stripError.set(`${part}: a strip must be wider than nothing`);
      widths.push(r.inches);
    }
    if (widths.length < 2) return this.stripError.set('a strip set has at least two strips, e.g. 2, 1, 2');
    this.stripError.set(null);
    const fabrics = this.fabrics();
    if (fabrics.length === 0) return this.stripError.set('add fabrics to the pattern first');
    const old = p.stripSet;
    const strips: StripSet = old
      ? { ...old, axisAngleDeg: angleDeg, strips: widths.map((w, i) => ({ fabricId: old.strips[i]?.fabricId ?? fabrics[i % fabrics.length].id, finishedWidthIn: w })) }
      : makeStripSet(fabrics, widths, angleDeg);
    this.session.apply('Strip set', (d) => setPatchStripSet(d, s.id, p.index, strips, this.session.editor.analysis));
  }

  protected setStripFabric(stripIndex: number, fabricId: string): void {
    const s = this.section();
    const p = this.patch();
    if (!s || !p?.stripSet) return;
    const strips = p.stripSet.strips.map((st, i) => (i === stripIndex ? { ...st, fabricId } : st));
    const next = { ...p.stripSet, strips };
    this.session.apply('Strip fabric', (d) => setPatchStripSet(d, s.id, p.index, next, this.session.editor.analysis));
  }

  protected removeStripSet(): void {
    const s = this.section();
    const p = this.patch();
    if (s && p) this.session.apply('Remove strip set', (d) => setPatchStripSet(d, s.id, p.index, undefined, this.session.editor.analysis));
  }

  protected changePattern(change: Parameters<typeof setPatternSettings>[1]): void {
    this.session.apply('Pattern settings', (d) => setPatternSettings(d, change));
  }

  protected setTyped(key: 'cx' | 'cy' | 'inner' | 'outer' | 'radius' | 'start' | 'sweep', value: number): void {
    this.typed.update((t) => ({ ...t, [key]: value }));
  }

  protected addTyped(): void {
    const t = this.typed();
    const tool = this.session.editor.tool;
    let r: { ok: true; sectionId: string } | { ok: false; message: string } | null = null;
    if (tool instanceof ArcSectionTool) {
      r = tool.commitTyped({ centre: { x: t.cx, y: t.cy }, innerRadiusIn: t.inner, outerRadiusIn: t.outer, startAngleDeg: t.start, sweepDeg: t.sweep });
    } else if (tool instanceof WedgeSectionTool) {
      r = tool.commitTyped({ centre: { x: t.cx, y: t.cy }, radiusIn: t.radius, startAngleDeg: t.start, sweepDeg: t.sweep });
    }
    this.typedError.set(r && !r.ok ? r.message : null);
  }
}
