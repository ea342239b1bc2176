import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { GuideDrawingComponent } from './guide-drawing.component';
import type { GuideDrawing } from './guide-drawing';
import type { JoinGuideStep, SectionGuide, SectionStep, SewingGuide } from './sewing-guide-types';
import { joinDrawing, joinPictureWords, sectionDrawing, sectionPictureWords } from './step-drawings';

/** One step of guided sewing: the picture and what to do, in words. */
@Component({
  selector: 'sw-guided-step',
  imports: [MatIconModule, GuideDrawingComponent],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './guided-step.component.html',
  styleUrl: './guided-step.component.scss',
})
export class GuidedStepComponent {
  /** The whole guide (fabrics of the block for the joins). */
  readonly guide = input.required<SewingGuide>();
  /** The section of a piecing or trimming step; null for a join. */
  readonly section = input<SectionGuide | null>(null);
  readonly step = input<SectionStep | null>(null);
  readonly join = input<JoinGuideStep | null>(null);
  protected readonly drawing = computed<GuideDrawing | null>(() => {
    const s = this.section();
    const step = this.step();
    const join = this.join();
    if (s && step) return sectionDrawing(s, step);
    if (join) return joinDrawing(this.guide(), join);
    return null;
  });
  /** The label of the patch sewn just before this one. */
  protected readonly previousLabel = computed(() => {
    const s = this.section();
    const step = this.step();
    if (!s || step?.kind !== 'piece') return '';
    const before = s.steps[step.position - 2];
    return before?.kind === 'piece' ? before.patchLabel : '';
  });

  protected stripNames(strips: readonly { name: string }[]): string {
    return strips.map((s) => s.name).join(', ');
  }

  protected readonly pictureWords = computed(() => {
    const s = this.section();
    const step = this.step();
    const join = this.join();
    if (s && step) return sectionPictureWords(s, step);
    if (join) return joinPictureWords(join);
    return '';
  });
}
