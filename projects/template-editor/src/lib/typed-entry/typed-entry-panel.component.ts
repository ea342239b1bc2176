import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { SectionGeometry } from '@seamwright/piecing';
import { NumberFieldComponent } from '../properties/number-field.component';
import { EditorSession } from '../session/editor-session';
import { readCorners } from './read-corners';

/** The kinds of section that can be typed. */
type TypedKind = 'straight' | 'arc' | 'wedge';

/** The numbers of a typed arc or wedge (inches and degrees). */
interface TypedCentred {
  cx: number;
  cy: number;
  inner: number;
  outer: number;
  radius: number;
  start: number;
  sweep: number;
}

/**
 * Drawing without a pointer ("Add by values"): a section from typed values (straight: its corners as
 * x, y pairs; arc and wedge: centre, radii, start angle and sweep) and a seam of the selected section
 * from its two typed ends. Lengths read as the side panel's fields read them (fractions, decimals,
 * cm). Each lands where the drawing tools would put it, through the same editor commands.
 */
@Component({
  selector: 'sw-typed-entry-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, NumberFieldComponent],
  templateUrl: './typed-entry-panel.component.html',
  styleUrl: './typed-entry-panel.component.scss',
})
export class TypedEntryPanelComponent {
  protected readonly session = inject(EditorSession);
  protected readonly unit = computed(() => this.session.settings().unit);
  protected readonly kind = signal<TypedKind>('straight');
  protected readonly corners = signal('2, 2; 10, 2; 10, 10; 2, 10');
  protected readonly centred = signal<TypedCentred>({ cx: 12, cy: 12, inner: 5, outer: 8, radius: 5, start: 0, sweep: 45 });
  protected readonly seam = signal({ ax: 0, ay: 0, bx: 0, by: 0 });
  protected readonly sectionError = signal<string | null>(null);
  protected readonly seamError = signal<string | null>(null);

  protected setCentred(key: keyof TypedCentred, value: number): void {
    this.centred.update((t) => ({ ...t, [key]: value }));
  }

  protected setSeam(key: 'ax' | 'ay' | 'bx' | 'by', value: number): void {
    this.seam.update((t) => ({ ...t, [key]: value }));
  }

  protected addSection(): void {
    let geometry: SectionGeometry;
    const t = this.centred();
    if (this.kind() === 'straight') {
      const r = readCorners(this.corners(), this.unit());
      if (!r.ok) return this.sectionError.set(r.message);
      geometry = { kind: 'straight', vertices: r.points };
    } else if (this.kind() === 'arc') {
      geometry = { kind: 'arc', centre: { x: t.cx, y: t.cy }, innerRadiusIn: t.inner, outerRadiusIn: t.outer, startAngleDeg: t.start, sweepDeg: t.sweep };
    } else {
      geometry = { kind: 'wedge', centre: { x: t.cx, y: t.cy }, radiusIn: t.radius, startAngleDeg: t.start, sweepDeg: t.sweep };
    }
    const r = this.session.editor.addSectionByValues(geometry);
    this.sectionError.set(r.ok ? null : r.message);
  }

  protected addSeam(): void {
    const m = this.seam();
    const r = this.session.editor.addSeamByValues({ x: m.ax, y: m.ay }, { x: m.bx, y: m.by });
    this.seamError.set(r.ok ? null : r.message);
  }
}
