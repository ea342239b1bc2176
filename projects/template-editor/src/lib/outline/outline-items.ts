import type { PatternDocument } from '@seamwright/piecing';
import { describeSection, type BoardSelection, type SectionAnalysis } from '../core/public-api';

/** One item of the Sections outline: a section (level 1) or one of its patches (level 2). */
export interface OutlineItem {
  /** Stable key: `s:<section id>` or `p:<section id>:<patch index>`. */
  key: string;
  level: 1 | 2;
  /** What the item says: "B, arc section, 4 patches" or "A2, Plum". */
  text: string;
  sectionId: string;
  /** The patch's derived index (its identity), for patch items. */
  patchIndex: number | null;
  /** Key of the section a patch item belongs to. */
  parentKey: string | null;
  /** The patch items of a section, in sewing order. */
  children: OutlineItem[];
}

/** The key of the item that stands for a board selection (the section's when no patch is selected). */
export function selectionKey(selection: BoardSelection): string | null {
  if (!selection.sectionId) return null;
  return selection.patchIndex === null ? `s:${selection.sectionId}` : `p:${selection.sectionId}:${selection.patchIndex}`;
}

/** The outline of a document: its sections in drawing order, each with its patches in sewing order. */
export function outlineItems(document: PatternDocument, analysis: SectionAnalysis): OutlineItem[] {
  const fabricNames = new Map(document.fabrics.map((f) => [f.id, f.name]));
  return document.sections.map((s) => {
    const key = `s:${s.id}`;
    let patches: ReturnType<SectionAnalysis['patches']> = [];
    try {
      patches = analysis.patches(s);
    } catch {
      patches = [];
    }
    const children = [...patches]
      .sort((a, b) => a.number - b.number)
      .map((p): OutlineItem => {
        const fabric = p.fabricId ? fabricNames.get(p.fabricId) : undefined;
        return {
          key: `p:${s.id}:${p.index}`,
          level: 2,
          text: fabric ? `${p.label}, ${fabric}` : p.label,
          sectionId: s.id,
          patchIndex: p.index,
          parentKey: key,
          children: [],
        };
      });
    return { key, level: 1, text: describeSection(s, analysis), sectionId: s.id, patchIndex: null, parentKey: null, children };
  });
}

/** The items a keyboard reaches, top to bottom: every section, and the patches of the expanded ones. */
export function visibleItems(items: readonly OutlineItem[], collapsed: ReadonlySet<string>): OutlineItem[] {
  return items.flatMap((s) => (collapsed.has(s.key) ? [s] : [s, ...s.children]));
}
