import {
  checkSewability,
  derivePatches,
  expandRingRepeat,
  flattenSectionOutline,
  locatePoint,
  sectionCuttingLine,
  splitSection,
  type PatternDocument,
  type Point,
  type Seam,
  type Section,
  type SectionGeometry,
  type SplitResult,
} from '@seamwright/piecing';
import { boardOrderSearch } from './order-search-runner';
import { matchedAssignment, toBoardPatch, withPatchDetails, type BoardOrderSearch, type BoardPatch, type BoardSewability } from './board-patch';

interface Entry {
  placements?: Section[];
  /** What deriving the patches gave: the patches and problems, or what it threw. */
  derived?: { patches: BoardPatch[]; problems: string[] } | { error: unknown };
  sewability?: BoardSewability;
}

type Split = SplitResult | { error: unknown };

/**
 * Derived facts about sections (outline, patches, problems, sewability), computed by
 * `@seamwright/piecing` once per section object. Sections are immutable, so a changed section is a new
 * object and gets new facts; an unchanged one keeps its cached ones. The split of an outline by its
 * seams is kept per (geometry, seams) pair, so a command that only changes numbers, fabrics or strip
 * sets (or a drag frame that first derives the bare section, then the assigned one) splits once.
 */
export class SectionAnalysis {
  private readonly entries = new WeakMap<Section, Entry>();
  private readonly outlines = new WeakMap<SectionGeometry, Point[]>();
  private readonly splits = new WeakMap<SectionGeometry, WeakMap<readonly Seam[], Split>>();
  private splitCount = 0;

  /** How many times an outline was split by its seams (the costly step), for tests and the benchmark. */
  get splitsMade(): number {
    return this.splitCount;
  }

  private entry(section: Section): Entry {
    let e = this.entries.get(section);
    if (!e) {
      e = {};
      this.entries.set(section, e);
    }
    return e;
  }

  /** The flattened outline of a section. */
  outline(section: Pick<Section, 'geometry'>): Point[] {
    let o = this.outlines.get(section.geometry);
    if (!o) {
      o = flattenSectionOutline(section.geometry);
      this.outlines.set(section.geometry, o);
    }
    return o;
  }

  private split(section: Section): SplitResult {
    let bySeams = this.splits.get(section.geometry);
    if (!bySeams) {
      bySeams = new WeakMap();
      this.splits.set(section.geometry, bySeams);
    }
    let s = bySeams.get(section.seams);
    if (!s) {
      this.splitCount++;
      try {
        s = splitSection(section);
      } catch (error) {
        s = { error };
      }
      bySeams.set(section.seams, s);
    }
    if ('error' in s) throw s.error;
    return s;
  }

  /**
   * The derived, numbered patches in split order (array position = `index`); throws what piecing threw
   * for an outline that cannot be split (commands then keep what they had).
   */
  derive(section: Section): BoardPatch[] {
    const e = this.entry(section);
    if (!e.derived) {
      try {
        const { patches, problems } = derivePatches(section, { split: this.split(section) });
        // Matching an assignment again (a point-in-polygon test per patch) is needed only for the details
        // derivePatches does not carry: a rough cut or a piece template.
        const details = section.patches.some((a) => a.roughCut !== undefined || a.pieceTemplate !== undefined);
        e.derived = {
          patches: patches.map((p) => (details ? withPatchDetails(toBoardPatch(p), matchedAssignment(section, p)) : toBoardPatch(p))).sort((p, q) => p.index - q.index),
          problems: problems.map((p) => p.message),
        };
      } catch (error) {
        e.derived = { error };
      }
    }
    if ('error' in e.derived) throw e.derived.error;
    return e.derived.patches;
  }

  /** The derived patches in split order, or none for a half-drawn or invalid outline (the board shows the outline alone). */
  patches(section: Section): BoardPatch[] {
    try {
      return this.derive(section);
    } catch {
      return [];
    }
  }

  /** Problems with the seams or patch assignments, in words. */
  problems(section: Section): string[] {
    try {
      this.derive(section);
    } catch (err) {
      return [err instanceof Error ? err.message : String(err)];
    }
    const d = this.entry(section).derived;
    return d && 'problems' in d ? d.problems : [];
  }

  /** The sewability check of the current order. */
  sewability(section: Section): BoardSewability {
    const e = this.entry(section);
    if (!e.sewability) {
      try {
        const verdict = checkSewability([...this.derive(section)].sort((a, b) => a.number - b.number));
        e.sewability = verdict.sewable || !verdict.failure ? { ok: true } : { ok: false, failingPatchNumber: verdict.failure.patchNumber, reason: verdict.failure.message };
      } catch (err) {
        e.sewability = { ok: false, reason: err instanceof Error ? err.message : String(err) };
      }
    }
    return e.sewability;
  }

  /** A sewable order for the section (patch numbers in sewing order), or why there is none. */
  findOrder(section: Section): BoardOrderSearch {
    return boardOrderSearch(section);
  }

  /** The cutting line (outline + seam allowance) of a section, or null when it cannot be made. */
  cuttingLine(section: Section, allowanceIn: number): Point[] | null {
    try {
      return sectionCuttingLine(section, allowanceIn);
    } catch {
      return null;
    }
  }

  /** The section as drawn followed by its ring-repeat copies (just the section without a repeat). */
  placements(section: Section): Section[] {
    const e = this.entry(section);
    return (e.placements ??= section.ringRepeat ? expandRingRepeat(section) : [section]);
  }

  /**
   * The topmost section whose outline holds `p`, or null. With `copies` (the default) a click on a
   * ring-repeat copy finds the section it copies.
   */
  sectionAt(document: PatternDocument, p: Point, options: { copies?: boolean } = {}): Section | null {
    const copies = options.copies ?? true;
    for (let i = document.sections.length - 1; i >= 0; i--) {
      const s = document.sections[i];
      if (holds(this.outline(s), p)) return s;
      if (copies && s.ringRepeat && this.placements(s).slice(1).some((c) => holds(this.outline(c), p))) return s;
    }
    return null;
  }

  /**
   * The patch of `section` that holds `p`, or null; on a ring-repeat copy, the section's own patch
   * that the copied one repeats (same split order, so the same index).
   */
  patchAt(section: Section, p: Point): BoardPatch | null {
    const own = this.patches(section);
    const inside = own.find((patch) => locatePoint(p, patch.polygon) === 'inside') ?? own.find((patch) => holds(patch.polygon, p));
    if (inside) return inside;
    if (!section.ringRepeat) return null;
    for (const copy of this.placements(section).slice(1)) {
      for (const patch of this.patches(copy)) if (holds(patch.polygon, p)) return own[patch.index] ?? null;
    }
    return null;
  }
}

/** Whether `p` lies inside or on `ring`. */
function holds(ring: readonly Point[], p: Point): boolean {
  return locatePoint(p, ring) !== 'outside';
}
