import type { PatternDocument, Point, Section } from '@seamwright/piecing';
import type { BoardPatch, BoardSewability, GeometryPort } from './geometry-port';

interface Entry {
  outline?: Point[];
  problems?: string[];
  patches?: BoardPatch[];
  sewability?: BoardSewability;
}

/**
 * Derived facts about sections (outline, patches, sewability), computed through the geometry port
 * once per section object. Sections are immutable, so a changed section is a new object and gets new
 * facts; an unchanged one keeps its cached ones.
 */
export class SectionAnalysis {
  private readonly cache = new WeakMap<Section, Entry>();

  constructor(readonly geometry: GeometryPort) {}

  private entry(section: Section): Entry {
    let e = this.cache.get(section);
    if (!e) {
      e = {};
      this.cache.set(section, e);
    }
    return e;
  }

  /** The flattened outline. */
  outline(section: Section): Point[] {
    const e = this.entry(section);
    return (e.outline ??= this.geometry.outline(section.geometry));
  }

  /** The derived, numbered patches. */
  patches(section: Section): BoardPatch[] {
    const e = this.entry(section);
    if (!e.patches) {
      try {
        e.patches = this.geometry.patches(section);
      } catch {
        // A half-drawn or invalid outline has no patches yet; the board shows the outline alone.
        e.patches = [];
      }
    }
    return e.patches;
  }

  /** Problems with the seams or patch assignments, in words. */
  problems(section: Section): string[] {
    const e = this.entry(section);
    if (!e.problems) {
      try {
        e.problems = this.geometry.problems(section);
      } catch (err) {
        e.problems = [err instanceof Error ? err.message : String(err)];
      }
    }
    return e.problems;
  }

  /** The sewability check of the current order. */
  sewability(section: Section): BoardSewability {
    const e = this.entry(section);
    if (!e.sewability) {
      try {
        e.sewability = this.geometry.sewability(section, this.patches(section));
      } catch (err) {
        e.sewability = { ok: false, reason: err instanceof Error ? err.message : String(err) };
      }
    }
    return e.sewability;
  }

  /** The topmost section whose outline holds `p`, or null. */
  sectionAt(document: PatternDocument, p: Point): Section | null {
    for (let i = document.sections.length - 1; i >= 0; i--) {
      const s = document.sections[i];
      if (this.geometry.contains(this.outline(s), p)) return s;
    }
    return null;
  }

  /** The patch of `section` that holds `p`, or null. */
  patchAt(section: Section, p: Point): BoardPatch | null {
    for (const patch of this.patches(section)) if (this.geometry.contains(patch.polygon, p)) return patch;
    return null;
  }
}
