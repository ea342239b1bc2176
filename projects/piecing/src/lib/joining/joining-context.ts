import type { PatternDocument, Point, Section } from '../document/pattern-schema';
import { matchingMarks, type MatchingMark } from '../fabrication/matching-marks/index';
import { withRingEdgesAsCurves } from './follow-ring-edges';
import { ContactFinder, sectionInstances, type SectionInstance } from './part-contacts';

// Marks on the two sides of a join coincide within this (inches).
export const MARKS_MATCH_IN = 0.001;

/** What the joining plan reads of a document, computed once: copies, contacts and matching marks. */
export class JoiningContext {
  readonly instances: SectionInstance[];
  readonly contacts: ContactFinder;
  readonly sections: Map<string, { section: Section; index: number; instances: number[] }>;
  private marksByInstance?: Map<string, MatchingMark[]>;

  constructor(readonly doc: Pick<PatternDocument, 'sections' | 'canvas'>) {
    this.instances = sectionInstances(doc);
    this.contacts = new ContactFinder(this.instances);
    this.sections = new Map(doc.sections.map((section, index) => [section.id, { section, index, instances: [] as number[] }]));
    this.instances.forEach((inst, k) => this.sections.get(inst.sectionId)!.instances.push(k));
  }

  /** The matching marks of every copy, by copy id (straight edges drawn against a ring count as curves). */
  marks(): Map<string, MatchingMark[]> {
    if (!this.marksByInstance) {
      this.marksByInstance = new Map();
      for (const s of matchingMarks(withRingEdgesAsCurves(this.doc))) for (const inst of s.instances) this.marksByInstance.set(inst.instanceId, inst.marks);
    }
    return this.marksByInstance;
  }

  /**
   * The matching marks of a join between copies `a` and copies `b`: each mark of an a-copy whose
   * neighbour is a b-copy, with its twin on that b-copy (null when the neighbour has none there).
   */
  joinMarks(a: readonly number[], b: readonly number[]): Array<{ a: Point; b: Point | null; kind: MatchingMark['kind'] }> {
    const marks = this.marks();
    const bIds = new Set(b.map((k) => this.instances[k].id));
    const out: Array<{ a: Point; b: Point | null; kind: MatchingMark['kind'] }> = [];
    for (const k of a) {
      const id = this.instances[k].id;
      for (const m of marks.get(id) ?? []) {
        if (!bIds.has(m.neighbourId)) continue;
        if (m.kind !== 'spacing') {
          out.push({ a: m.point, b: null, kind: m.kind });
          continue;
        }
        const twin = (marks.get(m.neighbourId) ?? []).find((o) => o.neighbourId === id && Math.hypot(o.point.x - m.point.x, o.point.y - m.point.y) <= MARKS_MATCH_IN);
        out.push({ a: m.point, b: twin ? twin.point : null, kind: m.kind });
      }
    }
    return out;
  }

  /** A spacing mark of a b-copy toward an a-copy that no a-copy mark matches, if any. */
  unmatchedOnB(a: readonly number[], b: readonly number[]): Point | undefined {
    const marks = this.marks();
    const aIds = new Set(a.map((k) => this.instances[k].id));
    for (const k of b) {
      const id = this.instances[k].id;
      for (const m of marks.get(id) ?? []) {
        if (!aIds.has(m.neighbourId) || m.kind !== 'spacing') continue;
        const twin = (marks.get(m.neighbourId) ?? []).some((o) => o.neighbourId === id && Math.hypot(o.point.x - m.point.x, o.point.y - m.point.y) <= MARKS_MATCH_IN);
        if (!twin) return m.point;
      }
    }
    return undefined;
  }

  /** The centre of the block: the middle of the canvas. */
  get blockCentre(): Point {
    return { x: this.doc.canvas.widthIn / 2, y: this.doc.canvas.heightIn / 2 };
  }
}
