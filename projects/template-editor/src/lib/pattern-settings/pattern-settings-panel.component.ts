import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { sectionsOutsideCanvas, stripSetDisplayName, type PatternDocument, type Section, type SectionOutsideCanvas } from '@seamwright/piecing';
import { PATTERN_NOTES_MAX, SEWING_SETTING_RANGES, patternStripSets, renameStripSet, setPatternNotes, setSewingSettings, type SewingSettingsChange } from '../core/public-api';
import { NumberFieldComponent } from '../properties/number-field.component';
import { EditorSession } from '../session/editor-session';
import { FabricSettingsComponent } from './fabric-settings.component';
import { ResizeDesignComponent } from './resize-design.component';

/**
 * Settings of the whole pattern: a warning when sections lie outside the drawing area, the sewing
 * numbers (seam allowance, piecing margin, blocks, pressings per template), the notes for the quilter, the fabrics, the names of
 * the strip sets, and resizing the design. Every change is one named, undoable step of the editing
 * session. Place it inside `<sw-pattern-editor>` (it uses that editor's session).
 */
@Component({
  selector: 'sw-pattern-settings-panel',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatFormFieldModule, MatInputModule, NumberFieldComponent, FabricSettingsComponent, ResizeDesignComponent],
  templateUrl: './pattern-settings-panel.component.html',
  styleUrl: './pattern-settings-panel.component.scss',
})
export class PatternSettingsPanelComponent {
  protected readonly session = inject(EditorSession);
  protected readonly ro = this.session.readOnly;
  protected readonly unit = computed(() => this.session.settings().unit);
  protected readonly doc = this.session.document;
  protected readonly ranges = SEWING_SETTING_RANGES;
  private readonly outsideCache = new WeakMap<Section, { widthIn: number; heightIn: number; result: SectionOutsideCanvas | null }>();

  /** Sections reaching outside the drawing area; each section is checked again only when it or the area changes. */
  protected readonly outside = computed(() => {
    const doc = this.doc();
    return doc.sections.map((s) => this.outsideOf(doc, s)).filter((r): r is SectionOutsideCanvas => r !== null);
  });
  protected readonly outsideText = computed(() =>
    this.outside()
      .map((s) => `${s.label} (${s.extent === 'wholly' ? 'wholly' : 'partly'})`)
      .join(', '),
  );
  protected readonly stripSets = computed(() => patternStripSets(this.doc()).map((s) => ({ ...s, fallback: stripSetDisplayName(null, s.patchLabels) })));
  /** Why the last strip-set name was refused, by strip set id. */
  protected readonly nameErrors = signal<Record<string, string>>({});

  protected readonly notesMax = PATTERN_NOTES_MAX;

  protected changeNotes(notes: string): void {
    this.session.apply('Pattern notes', (d) => setPatternNotes(d, notes));
  }

  protected changeSewing(change: SewingSettingsChange, label: string): void {
    this.session.apply(label, (d) => setSewingSettings(d, change));
  }

  protected renameStripSet(stripSetId: string, name: string): void {
    const error = name.trim().length > 80 ? 'a name is at most 80 characters' : null;
    this.nameErrors.update((all) => {
      const { [stripSetId]: _old, ...rest } = all;
      return error ? { ...rest, [stripSetId]: error } : rest;
    });
    if (!error) this.session.apply('Name strip set', (d) => renameStripSet(d, stripSetId, name));
  }

  private outsideOf(doc: PatternDocument, section: Section): SectionOutsideCanvas | null {
    const { widthIn, heightIn } = doc.canvas;
    const cached = this.outsideCache.get(section);
    if (cached && cached.widthIn === widthIn && cached.heightIn === heightIn) return cached.result;
    const result = sectionsOutsideCanvas({ ...doc, sections: [section] })[0] ?? null;
    this.outsideCache.set(section, { widthIn, heightIn, result });
    return result;
  }
}
