import type { Fabric, PatternDocument, Point, RingRepeat, Section, SectionGeometry, StripSet } from '@seamwright/piecing';
import type { SectionAnalysis } from '../analysis/section-analysis';
import { newId, nextSectionLabel } from './ids';
import { materialiseAssignments, syncAssignments } from './patch-assignments';
import { moveHandle, translateGeometry, type SectionHandle } from './section-handles';

/*
 * Commands: pure functions from a document to a new document. They copy only what they change, so
 * undo diffs stay small and unchanged sections keep their cached analysis.
 */

/** Finds a section by id. */
export function findSection(document: PatternDocument, sectionId: string): Section | undefined {
  return document.sections.find((s) => s.id === sectionId);
}

/** The document with one section replaced by `change(section)` (the same document when nothing changed). */
export function replaceSection(document: PatternDocument, sectionId: string, change: (s: Section) => Section): PatternDocument {
  const i = document.sections.findIndex((s) => s.id === sectionId);
  if (i < 0) return document;
  const next = change(document.sections[i]);
  if (next === document.sections[i]) return document;
  const sections = document.sections.slice();
  sections[i] = next;
  return { ...document, sections };
}

/** Adds a section with the next free label; returns the document and the new section's id. */
export function addSection(
  document: PatternDocument,
  geometry: SectionGeometry,
  analysis: SectionAnalysis,
): { document: PatternDocument; sectionId: string } {
  const section: Section = { id: newId('s'), label: nextSectionLabel(document), geometry, seams: [], patches: [] };
  section.patches = syncAssignments(analysis, null, section);
  return { document: { ...document, sections: [...document.sections, section] }, sectionId: section.id };
}

/** Replaces a section's geometry; patch numbers, fabrics and strip sets follow. */
export function setSectionGeometry(document: PatternDocument, sectionId: string, geometry: SectionGeometry, analysis: SectionAnalysis): PatternDocument {
  return replaceSection(document, sectionId, (s) => {
    const next = { ...s, geometry };
    return { ...next, patches: syncAssignments(analysis, s, next) };
  });
}

/** Moves vertex `index` of a straight section to `point`. */
export function moveVertex(document: PatternDocument, sectionId: string, index: number, point: Point, analysis: SectionAnalysis): PatternDocument {
  const s = findSection(document, sectionId);
  if (!s || s.geometry.kind !== 'straight') return document;
  return setSectionGeometry(document, sectionId, moveHandle(s.geometry, { kind: 'vertex', index }, point), analysis);
}

/** Moves any handle of a section (vertex, centre, radius, angle) to `point`. */
export function moveSectionHandle(
  document: PatternDocument,
  sectionId: string,
  handle: Pick<SectionHandle, 'kind' | 'index'>,
  point: Point,
  analysis: SectionAnalysis,
): PatternDocument {
  const s = findSection(document, sectionId);
  if (!s) return document;
  return setSectionGeometry(document, sectionId, moveHandle(s.geometry, handle, point), analysis);
}

/** Moves a whole section (outline, seams, patch anchors) by (dx, dy). */
export function moveSection(document: PatternDocument, sectionId: string, dx: number, dy: number): PatternDocument {
  if (dx === 0 && dy === 0) return document;
  const shift = (p: Point) => ({ x: p.x + dx, y: p.y + dy });
  return replaceSection(document, sectionId, (s) => ({
    ...s,
    geometry: translateGeometry(s.geometry, dx, dy),
    seams: s.seams.map((m) => ({ ...m, a: shift(m.a), b: shift(m.b) })),
    patches: s.patches.map((p) => ({ ...p, anchor: shift(p.anchor) })),
  }));
}

/** Removes a section. */
export function deleteSection(document: PatternDocument, sectionId: string): PatternDocument {
  const sections = document.sections.filter((s) => s.id !== sectionId);
  return sections.length === document.sections.length ? document : { ...document, sections };
}

/** Adds a straight seam a–b to a section; the patch it crosses splits in two. */
export function addSeam(document: PatternDocument, sectionId: string, a: Point, b: Point, analysis: SectionAnalysis): PatternDocument {
  return replaceSection(document, sectionId, (s) => {
    const next = { ...s, seams: [...s.seams, { id: newId('m'), a: { x: a.x, y: a.y }, b: { x: b.x, y: b.y } }] };
    return { ...next, patches: syncAssignments(analysis, s, next) };
  });
}

/** Removes a seam from a section; the two patches it split join again. */
export function deleteSeam(document: PatternDocument, sectionId: string, seamId: string, analysis: SectionAnalysis): PatternDocument {
  return replaceSection(document, sectionId, (s) => {
    if (!s.seams.some((m) => m.id === seamId)) return s;
    const next = { ...s, seams: s.seams.filter((m) => m.id !== seamId) };
    return { ...next, patches: syncAssignments(analysis, s, next) };
  });
}

/** Sets (or clears, with undefined) the ring repeat of a section. */
export function setRingRepeat(document: PatternDocument, sectionId: string, ringRepeat: RingRepeat | undefined): PatternDocument {
  return replaceSection(document, sectionId, (s) => {
    const { ringRepeat: _old, ...rest } = s;
    return ringRepeat ? { ...rest, ringRepeat: { count: ringRepeat.count, centre: { ...ringRepeat.centre } } } : rest;
  });
}

/** Changes a section's label or note. */
export function updateSectionDetails(document: PatternDocument, sectionId: string, details: { label?: string; note?: string }): PatternDocument {
  if (details.label && document.sections.some((s) => s.id !== sectionId && s.label === details.label)) return document;
  return replaceSection(document, sectionId, (s) => ({ ...s, ...details }));
}

function changePatch(
  document: PatternDocument,
  sectionId: string,
  patchIndex: number,
  analysis: SectionAnalysis,
  change: (p: ReturnType<typeof materialiseAssignments>[number]) => ReturnType<typeof materialiseAssignments>[number],
): PatternDocument {
  return replaceSection(document, sectionId, (s) => {
    const patches = materialiseAssignments(analysis.derive(s));
    if (patchIndex < 0 || patchIndex >= patches.length) return s;
    patches[patchIndex] = change(patches[patchIndex]);
    return { ...s, patches };
  });
}

/** Fills a patch with a fabric of the pattern (undefined clears it). */
export function setPatchFabric(document: PatternDocument, sectionId: string, patchIndex: number, fabricId: string | undefined, analysis: SectionAnalysis): PatternDocument {
  if (fabricId && !document.fabrics.some((f) => f.id === fabricId)) return document;
  return changePatch(document, sectionId, patchIndex, analysis, (p) => {
    const { fabricId: _old, ...rest } = p;
    return fabricId ? { ...rest, fabricId } : rest;
  });
}

/** Puts a strip set on a patch (undefined removes it). */
export function setPatchStripSet(document: PatternDocument, sectionId: string, patchIndex: number, stripSet: StripSet | undefined, analysis: SectionAnalysis): PatternDocument {
  return changePatch(document, sectionId, patchIndex, analysis, (p) => {
    const { stripSet: _old, ...rest } = p;
    return stripSet ? { ...rest, stripSet } : rest;
  });
}

/** A strip set of the given fabrics and finished widths, across the patch at `axisAngleDeg`. */
export function makeStripSet(fabrics: ReadonlyArray<Pick<Fabric, 'id'>>, widthsIn: readonly number[], axisAngleDeg = 0): StripSet {
  return {
    id: newId('t'),
    strips: widthsIn.map((w, i) => ({ fabricId: fabrics[i % fabrics.length].id, finishedWidthIn: w })),
    axisAngleDeg,
    offsetIn: 0,
  };
}

/**
 * Sets the piecing order: `order` lists derived patch indices in sewing order (first sewn first).
 * Patches left out follow in their present order.
 */
export function setPiecingOrder(document: PatternDocument, sectionId: string, order: readonly number[], analysis: SectionAnalysis): PatternDocument {
  return replaceSection(document, sectionId, (s) => {
    const derived = analysis.derive(s);
    const seen = new Set<number>();
    const sequence: number[] = [];
    for (const i of order) {
      if (i < 0 || i >= derived.length || seen.has(i)) continue;
      seen.add(i);
      sequence.push(i);
    }
    const rest = derived.map((p, i) => ({ p, i })).filter(({ i }) => !seen.has(i)).sort((x, y) => x.p.number - y.p.number);
    sequence.push(...rest.map(({ i }) => i));
    const patches = materialiseAssignments(derived);
    sequence.forEach((i, k) => (patches[i] = { ...patches[i], number: k + 1 }));
    return { ...s, patches };
  });
}

/** Applies a sewable order given as patch numbers in sewing order (as the order search returns it). */
export function applyOrderByNumbers(document: PatternDocument, sectionId: string, numbers: readonly number[], analysis: SectionAnalysis): PatternDocument {
  const s = findSection(document, sectionId);
  if (!s) return document;
  const derived = analysis.derive(s);
  const order = numbers.map((n) => derived.findIndex((p) => p.number === n)).filter((i) => i >= 0);
  return setPiecingOrder(document, sectionId, order, analysis);
}
