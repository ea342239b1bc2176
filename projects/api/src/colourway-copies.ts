/*
 * A quilter's own copy of a pattern's colourway (design §11, docs/api.md "Colourway copies"): the
 * bodies `/api/patterns/:id/colourway-copies` takes and what it answers. A copy is its owner's alone.
 */
import { z } from 'zod';
import { idSchema } from './requests';
import { multiLineText, singleLineText } from './text';

/** Most copies one user keeps of one pattern. */
export const MAX_COLOURWAY_COPIES = 20;

/** A fabric slot id of the pattern document (piecing's id rule). */
const slotIdSchema = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, 'must be a fabric id of letters, digits, "-" or "_"');

const copyName = z.string().overwrite(singleLineText).trim().min(1, 'must not be empty').max(80, 'must be at most 80 characters');

/** One fabric slot of a copy: the quilter's name and colour for it, and an optional note (a shop, a code). */
export const colourwayCopyFabricSchema = z.strictObject({
  name: z.string().overwrite(singleLineText).trim().min(1, 'must not be empty').max(80, 'must be at most 80 characters'),
  colour: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'must be a colour like #7a3b69'),
  note: z.string().overwrite(multiLineText).trim().max(200, 'must be at most 200 characters').optional(),
});
export type ColourwayCopyFabric = z.infer<typeof colourwayCopyFabricSchema>;

/** Fabric slots keyed by document fabric id (at most the document's 100 fabrics). */
export const colourwayCopyFabricsSchema = z
  .record(slotIdSchema, colourwayCopyFabricSchema)
  .refine((r) => Object.keys(r).length <= 100, { message: 'must have at most 100 fabric slots' });

/** A copy as the server answers it. `version` goes up by one on every save. */
export const colourwayCopySchema = z.strictObject({
  id: idSchema,
  patternId: idSchema,
  /** The colourway it was copied from; null when copied from the pattern's own fabrics. */
  sourceColourwayId: z.string().nullable(),
  name: z.string(),
  fabrics: z.record(z.string(), colourwayCopyFabricSchema),
  version: z.number().int().min(1),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});
export type ColourwayCopy = z.infer<typeof colourwayCopySchema>;
export const colourwayCopyAnswerSchema = z.strictObject({ copy: colourwayCopySchema });
export const colourwayCopyListAnswerSchema = z.strictObject({ items: z.array(colourwayCopySchema) });

/**
 * `POST /api/patterns/:id/colourway-copies`: copy one of the latest revision's colourways (`colourwayId`),
 * or the pattern's own fabrics (null). The name defaults to "My <colourway name>".
 */
export const createColourwayCopyBodySchema = z.strictObject({
  colourwayId: z.string().min(1).max(64).nullable(),
  name: copyName.optional(),
});
export type CreateColourwayCopyBody = z.input<typeof createColourwayCopyBodySchema>;

/**
 * `PATCH /api/patterns/:id/colourway-copies/:copyId`: a save on top of `version` (409 when the copy has
 * moved on). `fabrics` replaces every slot; each key must be a fabric of the latest revision.
 */
export const updateColourwayCopyBodySchema = z
  .strictObject({
    version: z.number().int().min(1),
    name: copyName.optional(),
    fabrics: colourwayCopyFabricsSchema.optional(),
  })
  .refine((b) => b.name !== undefined || b.fabrics !== undefined, { message: 'give name or fabrics' });
export type UpdateColourwayCopyBody = z.input<typeof updateColourwayCopyBodySchema>;

/** The 409 of a stale save: the copy as it is now. */
export const staleCopyDetailsSchema = z.strictObject({ latest: colourwayCopySchema });
