import type { PdfPen } from '../pdf-pen';
import { SheetFlow } from '../sheet-flow';
import type { SheetFrame } from '../sheet-frame';

/** What one booklet sheet holds: its header subtitle and the sections it is about. */
export interface BookletSheet {
  subtitle: string;
  sectionIds: string[];
}

/**
 * Flows the booklet's parts down its sheets: each part (cutting, a section's piecing steps, joining …)
 * starts on a fresh sheet, and every sheet remembers which part and sections it carries, for its
 * header and for the "not sewable as numbered" notice.
 */
export class BookletWriter {
  readonly sheets: BookletSheet[] = [];
  private current: BookletSheet = { subtitle: 'Booklet', sectionIds: [] };
  private flowOf?: SheetFlow;

  constructor(
    private readonly pen: PdfPen,
    private readonly addSheet: () => SheetFrame,
  ) {}

  /**
   * Begins a part on a new sheet (or, with `sameSheet`, below the previous part when there is room) and
   * hands back the flow to write it with.
   */
  part(subtitle: string, sectionIds: string[] = [], { sameSheet = false } = {}): SheetFlow {
    this.current = { subtitle, sectionIds };
    if (!this.flowOf) this.flowOf = new SheetFlow(this.pen, () => this.newSheet());
    else if (sameSheet && this.flowOf.roomLeft > 2) {
      const last = this.sheets[this.sheets.length - 1];
      last.subtitle = `${last.subtitle} · ${subtitle}`;
      this.flowOf.gap(0.15);
    } else {
      const before = this.sheets.length;
      this.flowOf.startSheet();
      // The sheet was still empty: it now belongs to this part.
      if (this.sheets.length === before && before > 0) this.sheets[before - 1] = { subtitle, sectionIds: [...sectionIds] };
    }
    return this.flowOf;
  }

  private newSheet(): SheetFrame {
    const frame = this.addSheet();
    this.sheets.push({ ...this.current, sectionIds: [...this.current.sectionIds] });
    return frame;
  }
}
