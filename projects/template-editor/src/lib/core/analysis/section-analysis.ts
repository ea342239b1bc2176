import { expandRingRepeat, type PatternDocument, type Point, type Section } from '@seamwright/piecing';
import type { BoardPatch, BoardSewability, GeometryPort } from './geometry-port';

interface Entry {
  placements?: Section[];
  outline?: Point[];
  problems?: string[];
  /** What the port's `patches` answered: the patches, or what it threw. */
  derived?: { patches: BoardPatch[] } | { error: unknown };
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
  /**
   * The geometry port for commands and tools: the given one, except that `patches` is derived once per
   * section object (a command on a section the board has drawn reuses the board's patches; it throws
   * again what it threw the first time).
   */
  readonly geometry: GeometryPort;

  constructor(port: GeometryPort) {
    this.geometry = {
      outline: (geometry) => port.outline(geometry),
      patches: (section) => {
        const e = this.entry(section);
        if (!e.derived) {
          try {
            e.derived = { patches: port.patches(section) };
          } catch (error) {
            e.derived = { error };
          }
        }
        if ('error' in e.derived) throw e.derived.error;
        return e.derived.patches;
      },
      problems: (section) => port.problems(section),
      sewability: (section, patches) => port.sewability(section, patches),
      findOrder: (section) => port.findOrder(section),
      cuttingLine: (section, allowanceIn) => port.cuttingLine(section, allowanceIn),
      contains: (ring, p) => port.contains(ring, p),
    };
  }

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
      if (this.geometry.contains(this.outline(s), p)) return s;
      if (copies && s.ringRepeat && this.placements(s).slice(1).some((c) => this.geometry.contains(this.outline(c), p))) return s;
    }
    return null;
  }

  /**
   * The patch of `section` that holds `p`, or null; on a ring-repeat copy, the section's own patch
   * that the copied one repeats (same split order, so the same index).
   */
  patchAt(section: Section, p: Point): BoardPatch | null {
    for (const patch of this.patches(section)) if (this.geometry.contains(patch.polygon, p)) return patch;
    if (!section.ringRepeat) return null;
    const own = this.patches(section);
    for (const copy of this.placements(section).slice(1)) {
      for (const patch of this.patches(copy)) if (this.geometry.contains(patch.polygon, p)) return own[patch.index] ?? null;
    }
    return null;
  }
}
