import { z } from 'zod';
import { validatePatternGeometry } from './validate-geometry';

/**
 * The pattern document, format version 2 (version 1 documents are upgraded on reading).
 *
 * Conventions (see docs/pattern-format.md):
 * - every length is in inches (`…In`), whatever unit the user prefers to see;
 * - coordinates are in the pattern's drawing plane, x to the right, y **down** (as on screen and in a
 *   PDF page drawn top-down), origin at the top-left of the drawing area;
 * - angles are in degrees (`…Deg`), measured from +x towards +y (clockwise on screen);
 * - sections are drawn as seen from the front of the block; print sets mirror them.
 */
export const FORMAT_VERSION = 2 as const;

/** Every format version this program reads; older ones are upgraded by `migratePatternDocument`. */
export const READABLE_FORMAT_VERSIONS = [1, 2] as const;

/** Largest coordinate or length accepted, in inches: no quilt section is larger. */
export const MAX_SIZE_IN = 200;

// Bounds are zod checks (not refinements) so that the exported JSON Schema carries them too.
// zod 4 numbers already reject NaN and ±Infinity.
const finite = z.number({ error: 'must be a finite number' });
const coordinate = finite
  .min(-MAX_SIZE_IN, { message: `must be within ±${MAX_SIZE_IN} in.` })
  .max(MAX_SIZE_IN, { message: `must be within ±${MAX_SIZE_IN} in.` });
const positiveLength = finite
  .gt(0, { message: 'must be greater than zero' })
  .lte(MAX_SIZE_IN, { message: `must be at most ${MAX_SIZE_IN} in.` });
/** Narrowest sweep accepted, in degrees: below it a section has no sewable width (and flattening has no chord). */
export const MIN_SWEEP_DEG = 0.01;
const sweep = finite
  .gte(MIN_SWEEP_DEG, { message: 'must be at least 0.01° and at most 360°' })
  .lte(360, { message: 'must be at least 0.01° and at most 360°' });
const id = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[A-Za-z0-9_-]+$/, 'must be letters, digits, "-" or "_"');

export const pointSchema = z.object({ x: coordinate, y: coordinate });

export const fabricSchema = z.object({
  id,
  name: z.string().min(1).max(80),
  /** Display colour, `#rrggbb`. */
  colour: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'must be a colour like #7a3b69'),
  /** Usable width of fabric after the selvages are trimmed (common practice: 40–42 in.). */
  usableWofIn: positiveLength.default(42),
});

/**
 * Largest |bulge| of a curved edge: 1 is a half circle. An edge curving further would wrap back past
 * its own ends, which no foundation-pieced section needs (a rounder outline is a wedge or arc section).
 */
export const MAX_BULGE = 1;

/**
 * The curve of one edge of a straight section, as its bulge b = tan(θ/4), θ the signed angle the edge
 * turns through about its circle's centre going from its first vertex to the next: 0 is a straight
 * edge, ±1 a half circle. Positive θ turns the document's positive way (from +x towards +y, clockwise on
 * screen), so a positive bulge lies to the left of the direction of travel as seen on screen; on an
 * outline wound clockwise on screen that is outward (a convex edge), on one wound the other way inward.
 */
const bulge = finite
  .min(-MAX_BULGE, { message: `must be between -${MAX_BULGE} and ${MAX_BULGE} (a half circle)` })
  .max(MAX_BULGE, { message: `must be between -${MAX_BULGE} and ${MAX_BULGE} (a half circle)` });

export const straightGeometrySchema = z
  .object({
    kind: z.literal('straight'),
    /** Outline vertices in order (either winding); the ring is closed implicitly. */
    vertices: z.array(pointSchema).min(3).max(2000),
    /**
     * Optional curve of each edge, one per vertex: edge i runs from vertex i to vertex i + 1 (the last
     * back to the first). Missing means every edge is straight. See {@link MAX_BULGE} and `bulge` above.
     */
    bulges: z
      .array(bulge)
      .max(2000)
      .optional()
      .meta({
        description:
          'Curve of each edge, one per vertex: edge i runs from vertex i to vertex i + 1. Bulge = tan(θ/4), θ the signed angle the edge ' +
          'turns about its circle\'s centre, positive from +x towards +y (clockwise on screen); 0 is straight, ±1 a half circle.',
      }),
  })
  .refine((g) => g.bulges === undefined || g.bulges.length === g.vertices.length, {
    message: 'must have one bulge per vertex (edge i runs from vertex i to vertex i + 1)',
    path: ['bulges'],
  });

export const arcGeometrySchema = z
  .object({
    kind: z.literal('arc'),
    centre: pointSchema,
    innerRadiusIn: positiveLength,
    outerRadiusIn: positiveLength,
    startAngleDeg: finite,
    sweepDeg: sweep,
  })
  .refine((g) => g.innerRadiusIn < g.outerRadiusIn, {
    message: 'inner radius must be smaller than outer radius',
    path: ['innerRadiusIn'],
  });

export const wedgeGeometrySchema = z.object({
  kind: z.literal('wedge'),
  centre: pointSchema,
  radiusIn: positiveLength,
  startAngleDeg: finite,
  sweepDeg: sweep,
});

export const sectionGeometrySchema = z.discriminatedUnion('kind', [
  straightGeometrySchema,
  arcGeometrySchema,
  wedgeGeometrySchema,
]);

/** A straight seam line that splits the patch it crosses. Seams apply in document order. */
export const seamSchema = z.object({
  id,
  a: pointSchema,
  b: pointSchema,
  /**
   * How this seam is pressed once its patch is sewn: toward the patch just added (`added`, the default
   * and usual practice on a foundation), toward the patches sewn before it (`previous`), or open.
   */
  press: z.enum(['added', 'previous', 'open']).optional(),
});

/** Which way a patch seam is pressed (see {@link seamSchema}); missing means `added`. */
export const SEAM_PRESS_DEFAULT = 'added' as const;

export const stripSchema = z.object({
  fabricId: id,
  finishedWidthIn: positiveLength,
});

/**
 * A patch filled with a pre-sewn strip set. Strips lie side by side, parallel to `axisAngleDeg`;
 * the set is centred on the patch's centroid, moved across the strips by `offsetIn`.
 */
export const stripSetSchema = z.object({
  id,
  name: z.string().max(80).optional(),
  strips: z.array(stripSchema).min(2).max(30),
  axisAngleDeg: finite.default(0),
  offsetIn: finite.default(0),
  /** Length of each slice cut across the sewn set, when the designer sets it (else the cutting list computes it). */
  subCutLengthIn: positiveLength.optional(),
});

/** The rough-cut piece the designer sets for a patch, in place of the computed one (e.g. a 3 in. square). */
export const roughCutSchema = z.object({
  widthIn: positiveLength,
  lengthIn: positiveLength,
});

/**
 * What the designer says about one derived patch. Derived patches are matched to these by `anchor`,
 * a point inside the patch, so assignments survive re-ordering of seams.
 */
export const patchSchema = z
  .object({
    number: z.number().int().min(1).max(999),
    anchor: pointSchema,
    fabricId: id.optional(),
    stripSet: stripSetSchema.optional(),
    /** The designer's rough-cut piece; the cutting list warns when it cannot cover the patch with its allowance. */
    roughCut: roughCutSchema.optional(),
    /** Whether the print set carries a piece template for this patch (patches cut from a strip set always get one). */
    pieceTemplate: z.boolean().optional(),
  });

export const ringRepeatSchema = z.object({
  /** Number of copies around the circle, the original included. */
  count: z.number().int().min(2).max(360),
  centre: pointSchema,
});

export const sectionSchema = z.object({
  id,
  /** Section letter(s) as quilters write them: A, B … Z, AA … */
  label: z.string().regex(/^[A-Z]{1,3}$/, 'must be one to three capital letters'),
  geometry: sectionGeometrySchema,
  seams: z.array(seamSchema).max(500).default([]),
  patches: z.array(patchSchema).max(500).default([]),
  ringRepeat: ringRepeatSchema.optional(),
  /** The designer's note for the quilter about this section (pressing direction, tips); shown on its template. */
  note: z.string().max(500).optional(),
});

/** Joins all ring copies of a section into a ring: count joins, the last one closing the ring. */
export const ringJoinStepSchema = z.object({
  id,
  kind: z.literal('ring'),
  sectionId: id,
  /** Which way the seams between copies are pressed: all turning the same way round the ring, or open. */
  press: z.enum(['clockwise', 'anticlockwise', 'open']),
});

/**
 * Joins two parts: each of `a` and `b` names a section id, or the id of an earlier step (the unit it
 * made). A section with a ring repeat takes part in joins through its ring step.
 */
export const pairJoinStepSchema = z.object({
  id,
  kind: z.literal('join'),
  a: id,
  b: id,
  /** Toward part `a`, toward part `b`, or open. */
  press: z.enum(['a', 'b', 'open']),
});

export const joinStepSchema = z.discriminatedUnion('kind', [ringJoinStepSchema, pairJoinStepSchema]);

/**
 * The order and way sections are joined into units and units into the block: a tree of joins written
 * as steps in sewing order. Whether it can be sewn is checked by `checkJoiningPlan` (the document only
 * holds its shape), so a plan naming a deleted section still reads and is reported, not refused.
 */
export const joiningPlanSchema = z.object({
  steps: z.array(joinStepSchema).max(4000),
});

export const referenceImageSchema = z.object({
  uploadId: id,
  origin: pointSchema,
  widthIn: positiveLength,
  opacity: z.number().min(0).max(1).default(0.4),
});

/** Most blocks across or down a quilt. */
export const MAX_QUILT_BLOCKS_PER_SIDE = 100;

const blockCountAlongSide = z
  .number({ error: 'must be a whole number' })
  .int({ message: 'must be a whole number' })
  .min(1, { message: 'must be at least 1' })
  .max(MAX_QUILT_BLOCKS_PER_SIDE, { message: `must be at most ${MAX_QUILT_BLOCKS_PER_SIDE}` });
const nonNegativeLength = finite
  .min(0, { message: 'must not be negative' })
  .lte(MAX_SIZE_IN, { message: `must be at most ${MAX_SIZE_IN} in.` });

/**
 * One position of the quilt layout that differs from a plain copy of the block. Straight setting: `row`
 * and `col` count from the top-left block. On point: `row` counts the horizontal rows of block centres
 * from the top (0 … 2·rows − 2), `col` the blocks along that row from the left (even rows hold `columns`
 * blocks, odd rows `columns − 1`).
 */
export const quiltCellSchema = z.object({
  row: z.number().int({ message: 'must be a whole number' }).min(0, { message: 'must not be negative' }).max(2 * MAX_QUILT_BLOCKS_PER_SIDE),
  col: z.number().int({ message: 'must be a whole number' }).min(0, { message: 'must not be negative' }).max(2 * MAX_QUILT_BLOCKS_PER_SIDE),
  /** Turn of the block, clockwise on screen. */
  rotateDeg: z.union([z.literal(0), z.literal(90), z.literal(180), z.literal(270)], { error: 'must be 0, 90, 180 or 270' }).optional(),
  /** Mirrored left to right (before turning). */
  mirrored: z.boolean().optional(),
  /** A plain block of `alternateFabricId` in place of the pieced block. */
  alternate: z.boolean().optional(),
});

export const quiltBorderSchema = z.object({
  widthIn: positiveLength,
  fabricId: id,
});

/** A named size of the quilt for the size chart (e.g. "Throw 4 × 5"). */
export const quiltSizeSchema = z.object({
  name: z.string().trim().min(1, { message: 'must not be empty' }).max(60),
  columns: blockCountAlongSide,
  rows: blockCountAlongSide,
});

/**
 * How blocks are set into a quilt (design §11, docs/quilt-layout.md): setting, blocks across and down,
 * per-cell turns, mirroring and plain blocks, sashing between blocks, borders inside out, binding,
 * backing and named sizes. Every length is finished, in inches.
 */
export const quiltLayoutSchema = z.object({
  setting: z.enum(['straight', 'on-point']).default('straight'),
  /** Blocks across (on point: blocks along the top edge). */
  columns: blockCountAlongSide,
  /** Blocks down (on point: blocks down the side). */
  rows: blockCountAlongSide,
  /** Finished block size; missing means the bounding box of all sections' sewing lines (ring copies included). */
  blockSizeIn: z.object({ width: positiveLength, height: positiveLength }).optional(),
  cells: z.array(quiltCellSchema).max(40000).optional(),
  /** Fabric of the plain alternate blocks (cells with `alternate`). */
  alternateFabricId: id.optional(),
  /**
   * Straight: strips between blocks (not around the outside), with optional cornerstones where they cross.
   * On point: strips frame every block and cornerstones sit at every corner (docs/quilt-layout.md).
   */
  sashing: z.object({ widthIn: positiveLength, fabricId: id, cornerstoneFabricId: id.optional() }).optional(),
  /** Borders, innermost first. */
  borders: z.array(quiltBorderSchema).max(12).default([]),
  binding: z
    .object({
      fabricId: id.optional(),
      /** Cut width of the binding strips (common practice: 2½ in., folded double). */
      stripWidthIn: positiveLength.default(2.5),
      /** Length added to the perimeter for the corners and the join (common practice: about 12 in.). */
      extraIn: nonNegativeLength.default(12),
    })
    .prefault({}),
  backing: z
    .object({
      fabricId: id.optional(),
      /** Backing and batting reach this far beyond the quilt top on every side (common practice: about 4 in.). */
      marginIn: nonNegativeLength.default(4),
    })
    .prefault({}),
  /** Fabric of the setting triangles (on point). */
  settingTrianglesFabricId: id.optional(),
  /** Named sizes for the size chart; each sets columns and rows. */
  sizes: z.array(quiltSizeSchema).max(20).default([]),
});

/** A fabric as a colourway shows it: its own name and colour in place of the document's. */
export const colourwayFabricSchema = z.object({
  name: z.string().min(1).max(80),
  colour: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'must be a colour like #7a3b69'),
});

/** The same drafting in other fabrics: for each fabric slot (a document fabric id), its name and colour. */
export const colourwaySchema = z.object({
  id,
  name: z.string().trim().min(1, { message: 'must not be empty' }).max(80),
  /** Keyed by document fabric id; a slot left out keeps the document's fabric. */
  fabrics: z.record(id, colourwayFabricSchema),
});

export const patternDocumentSchema = z
  .object({
    // A version 1 document is a version 2 document without curved edges, so the schema reads both and
    // always answers the current version (parsePatternDocument upgrades step by step before this).
    formatVersion: z.literal(READABLE_FORMAT_VERSIONS).transform((): typeof FORMAT_VERSION => FORMAT_VERSION),
    title: z.string().trim().min(1).max(120),
    /** The unit the user prefers to see; the document itself is always in inches. */
    displayUnit: z.enum(['in', 'cm']).default('in'),
    seamAllowanceIn: finite.gt(0, { message: 'must be greater than zero' }).lte(2, { message: 'must be at most 2 in.' }).default(0.25),
    /** Extra margin around each rough-cut piece for placement on the foundation. */
    piecingMarginIn: finite.min(0, { message: 'must be between 0 and 4 in.' }).max(4, { message: 'must be between 0 and 4 in.' }).default(0.5),
    /** How many times the whole pattern is made (blocks in the quilt). */
    blockCount: z.number().int().min(1).max(1000).default(1),
    /** How many pressings a freezer-paper template survives (common practice: about a dozen or more). */
    pressingsPerTemplate: z.number().int().min(1).max(1000).default(16),
    /** Size of the drawing area (the finished block), for display and previews. */
    canvas: z.object({ widthIn: positiveLength, heightIn: positiveLength }),
    fabrics: z.array(fabricSchema).max(100).default([]),
    sections: z.array(sectionSchema).max(2000).default([]),
    referenceImage: referenceImageSchema.optional(),
    /** The designer's notes for the quilter, shown on the cover of the print set. */
    notes: z.string().max(4000).optional(),
    /** The designer's joining plan; without one the library proposes a default (`defaultJoiningPlan`). */
    joiningPlan: joiningPlanSchema.optional(),
    /** How the block is set into a quilt (design §11); missing means the pattern is one block. */
    quilt: quiltLayoutSchema.optional(),
    /** Other colourways of the same drafting (design §11). */
    colourways: z.array(colourwaySchema).max(20).optional(),
  })
  .superRefine((doc, ctx) => {
    const fabricIds = new Set<string>();
    doc.fabrics.forEach((f, i) => {
      if (fabricIds.has(f.id)) ctx.addIssue({ code: 'custom', message: `duplicate fabric id "${f.id}"`, path: ['fabrics', i, 'id'] });
      fabricIds.add(f.id);
    });
    const sectionIds = new Set<string>();
    const labels = new Set<string>();
    doc.sections.forEach((s, i) => {
      if (sectionIds.has(s.id)) ctx.addIssue({ code: 'custom', message: `duplicate section id "${s.id}"`, path: ['sections', i, 'id'] });
      sectionIds.add(s.id);
      if (labels.has(s.label)) ctx.addIssue({ code: 'custom', message: `duplicate section label "${s.label}"`, path: ['sections', i, 'label'] });
      labels.add(s.label);
      const numbers = new Set<number>();
      s.patches.forEach((p, j) => {
        if (numbers.has(p.number)) ctx.addIssue({ code: 'custom', message: `duplicate patch number ${p.number}`, path: ['sections', i, 'patches', j, 'number'] });
        numbers.add(p.number);
        if (p.fabricId && !fabricIds.has(p.fabricId)) ctx.addIssue({ code: 'custom', message: `unknown fabric "${p.fabricId}"`, path: ['sections', i, 'patches', j, 'fabricId'] });
        p.stripSet?.strips.forEach((st, k) => {
          if (!fabricIds.has(st.fabricId)) ctx.addIssue({ code: 'custom', message: `unknown fabric "${st.fabricId}"`, path: ['sections', i, 'patches', j, 'stripSet', 'strips', k, 'fabricId'] });
        });
      });
    });
    const stepIds = new Set<string>();
    doc.joiningPlan?.steps.forEach((step, i) => {
      if (stepIds.has(step.id)) ctx.addIssue({ code: 'custom', message: `duplicate joining step id "${step.id}"`, path: ['joiningPlan', 'steps', i, 'id'] });
      if (sectionIds.has(step.id)) ctx.addIssue({ code: 'custom', message: `joining step id "${step.id}" is also a section id`, path: ['joiningPlan', 'steps', i, 'id'] });
      stepIds.add(step.id);
    });
    if (doc.quilt) checkQuiltLayout(doc.quilt, fabricIds, ctx);
    const colourwayIds = new Set<string>();
    doc.colourways?.forEach((c, i) => {
      if (colourwayIds.has(c.id)) ctx.addIssue({ code: 'custom', message: `duplicate colourway id "${c.id}"`, path: ['colourways', i, 'id'] });
      colourwayIds.add(c.id);
      for (const fabricId of Object.keys(c.fabrics)) {
        if (!fabricIds.has(fabricId)) ctx.addIssue({ code: 'custom', message: `unknown fabric "${fabricId}"`, path: ['colourways', i, 'fabrics', fabricId] });
      }
    });
    // Outlines that cross themselves, outlines without area, seams without length.
    for (const issue of validatePatternGeometry(doc)) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
  });

type QuiltLayoutParsed = z.infer<typeof quiltLayoutSchema>;

/** Cross-field rules of a quilt layout: known fabrics, one entry per cell, a square block for an on-point setting. */
function checkQuiltLayout(quilt: QuiltLayoutParsed, fabricIds: ReadonlySet<string>, ctx: z.RefinementCtx): void {
  const fabric = (fabricId: string | undefined, path: Array<string | number>) => {
    if (fabricId !== undefined && !fabricIds.has(fabricId)) ctx.addIssue({ code: 'custom', message: `unknown fabric "${fabricId}"`, path: ['quilt', ...path] });
  };
  fabric(quilt.alternateFabricId, ['alternateFabricId']);
  fabric(quilt.sashing?.fabricId, ['sashing', 'fabricId']);
  fabric(quilt.sashing?.cornerstoneFabricId, ['sashing', 'cornerstoneFabricId']);
  quilt.borders.forEach((b, i) => fabric(b.fabricId, ['borders', i, 'fabricId']));
  fabric(quilt.binding.fabricId, ['binding', 'fabricId']);
  fabric(quilt.backing.fabricId, ['backing', 'fabricId']);
  fabric(quilt.settingTrianglesFabricId, ['settingTrianglesFabricId']);
  if (quilt.setting === 'on-point') {
    if (quilt.blockSizeIn && Math.abs(quilt.blockSizeIn.width - quilt.blockSizeIn.height) > 1e-9) {
      ctx.addIssue({ code: 'custom', message: 'an on-point setting needs a square block', path: ['quilt', 'blockSizeIn'] });
    }
  }
  const cells = new Set<string>();
  quilt.cells?.forEach((c, i) => {
    const key = `${c.row},${c.col}`;
    if (cells.has(key)) ctx.addIssue({ code: 'custom', message: `duplicate cell at row ${c.row}, column ${c.col}`, path: ['quilt', 'cells', i] });
    cells.add(key);
    if (c.alternate && quilt.alternateFabricId === undefined) {
      ctx.addIssue({ code: 'custom', message: 'a plain alternate block needs alternateFabricId', path: ['quilt', 'cells', i, 'alternate'] });
    }
  });
  const names = new Set<string>();
  quilt.sizes.forEach((s, i) => {
    if (names.has(s.name)) ctx.addIssue({ code: 'custom', message: `duplicate size name "${s.name}"`, path: ['quilt', 'sizes', i, 'name'] });
    names.add(s.name);
  });
}

export type Point = z.infer<typeof pointSchema>;
export type Fabric = z.infer<typeof fabricSchema>;
export type StraightGeometry = z.infer<typeof straightGeometrySchema>;
export type ArcGeometry = z.infer<typeof arcGeometrySchema>;
export type WedgeGeometry = z.infer<typeof wedgeGeometrySchema>;
export type SectionGeometry = z.infer<typeof sectionGeometrySchema>;
export type SectionKind = SectionGeometry['kind'];
export type Seam = z.infer<typeof seamSchema>;
export type Strip = z.infer<typeof stripSchema>;
export type StripSet = z.infer<typeof stripSetSchema>;
export type PatchAssignment = z.infer<typeof patchSchema>;
export type RingRepeat = z.infer<typeof ringRepeatSchema>;
export type SeamPress = NonNullable<Seam['press']>;
export type RoughCut = z.infer<typeof roughCutSchema>;
export type RingJoinStepInput = z.infer<typeof ringJoinStepSchema>;
export type PairJoinStepInput = z.infer<typeof pairJoinStepSchema>;
/** One step of a joining plan as the document holds it. */
export type JoinStepInput = z.infer<typeof joinStepSchema>;
export type JoiningPlanInput = z.infer<typeof joiningPlanSchema>;
export type Section = z.infer<typeof sectionSchema>;
export type ReferenceImage = z.infer<typeof referenceImageSchema>;
export type QuiltCell = z.infer<typeof quiltCellSchema>;
export type QuiltBorder = z.infer<typeof quiltBorderSchema>;
export type QuiltSize = z.infer<typeof quiltSizeSchema>;
/** A validated quilt layout (defaults filled in). */
export type QuiltLayout = z.infer<typeof quiltLayoutSchema>;
/** A quilt layout as written by hand or sent by a client. */
export type QuiltLayoutInput = z.input<typeof quiltLayoutSchema>;
export type QuiltSetting = QuiltLayout['setting'];
export type ColourwayFabric = z.infer<typeof colourwayFabricSchema>;
export type Colourway = z.infer<typeof colourwaySchema>;
/** A validated pattern document (defaults filled in). */
export type PatternDocument = z.infer<typeof patternDocumentSchema>;
/** A pattern document as written by hand or sent by a client (defaults may be missing). */
export type PatternDocumentInput = z.input<typeof patternDocumentSchema>;
