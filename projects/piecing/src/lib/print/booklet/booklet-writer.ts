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
 * starts on a fresh sheet unless it asks to go on below the previous one, and every sheet remembers which part and sections it carries, for its
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
   * Begins a part on a new sheet (or, with `sameSheet`, below the previous part when at least `minRoomIn`
   * is left over) and hands back the flow to write it with. With `subtitleOf`, a sheet that several such parts
   * share is titled by all their sections (`subtitleOf(sectionIds)`) instead of "first · second".
   */
  part(
    subtitle: string,
    sectionIds: string[] = [],
    { sameSheet = false, minRoomIn = 2, subtitleOf }: { sameSheet?: boolean; minRoomIn?: number; subtitleOf?: (sectionIds: string[]) => string } = {},
  ): SheetFlow {
    this.current = { subtitle, sectionIds };
    if (!this.flowOf) this.flowOf = new SheetFlow(this.pen, () => this.newSheet());
    else if (sameSheet && this.flowOf.roomLeft > minRoomIn) {
      const last = this.sheets[this.sheets.length - 1];
      if (subtitleOf) {
        last.sectionIds = [...new Set([...last.sectionIds, ...sectionIds])];
        last.subtitle = subtitleOf(last.sectionIds);
      } else last.subtitle = `${last.subtitle} · ${subtitle}`;
      this.flowOf.gap(0.15);
    } else {
      const before = this.sheets.length;
      this.flowOf.startSheet();
      // The sheet was still empty: it now belongs to this part.
      if (this.sheets.length === before && before > 0) this.sheets[before - 1] = { subtitle, sectionIds: [...sectionIds] };
    }
    return this.flowOf;
  }

  /** Room left on the sheet being written, in inches (0 before the first part). */
  get roomLeft(): number {
    return this.flowOf?.roomLeft ?? 0;
  }

  private newSheet(): SheetFrame {
    const frame = this.addSheet();
    this.sheets.push({ ...this.current, sectionIds: [...this.current.sectionIds] });
    return frame;
  }
}
