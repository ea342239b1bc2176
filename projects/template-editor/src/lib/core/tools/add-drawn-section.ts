import type { SectionGeometry } from '@seamwright/piecing';
import { addSection } from '../commands/section-commands';
import type { ToolContext } from './tool';

/** What a tool's `commitTyped` answers: the new section, or the problem with the numbers in words. */
export type TypedResult = { ok: true; sectionId: string } | { ok: false; message: string };

/** Adds `geometry` as a new section in one undo step, selects it and returns its id. */
export function addDrawnSection(ctx: ToolContext, label: string, geometry: SectionGeometry): string {
  const { store, analysis } = ctx;
  let id = '';
  store.apply(label, (d) => {
    const r = addSection(d, geometry, analysis);
    id = r.sectionId;
    return r.document;
  });
  store.select({ sectionId: id, patchIndex: null });
  return id;
}

/** The part of a geometry schema (zod) that {@link parseTypedGeometry} uses. */
interface GeometrySchema<G> {
  safeParse(value: unknown): { success: true; data: G } | { success: false; error: { issues: ReadonlyArray<{ path: readonly PropertyKey[]; message: string }> } };
}

/**
 * Checks typed numbers against the geometry schema: the parsed geometry, or the first issue in words
 * (`path: message`, with `kind` as the path when the issue is about the whole shape).
 */
export function parseTypedGeometry<G extends SectionGeometry>(schema: GeometrySchema<G>, value: G): { ok: true; geometry: G } | { ok: false; message: string } {
  const parsed = schema.safeParse(value);
  if (parsed.success) return { ok: true, geometry: parsed.data };
  const issue = parsed.error.issues[0];
  return { ok: false, message: `${issue.path.join('.') || value.kind}: ${issue.message}` };
}
