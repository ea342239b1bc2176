/*
 * Test and benchmark entry of @seamwright/piecing ('@seamwright/piecing/testing'): names that only
 * specs outside the library and the benchmarks need, and reference implementations to compare with.
 * Not for product code; the product imports '@seamwright/piecing'.
 */

/** A section's exact area (arcs included), to check flattened and fitted outlines against. */
export { exactSectionArea } from './lib/geometry/index';

/** Uniform scaling of a document, to build expected values for a resize. */
export { scalePattern } from './lib/document/index';

/** A generated pattern of a chosen size, for benchmarks. */
export { buildStressPattern } from './lib/demo/index';

/** Seam-allowance internals the geometry benchmark times, and the JTS buffer it compares them with. */
export { MITRE_LIMIT } from './lib/tolerance';
export { PolygonOffsetter, toIntegerRing } from './lib/fabrication/index';
export {
  toJstsPolygon,
  jstsBufferParameters,
  jstsBufferPolygon,
  jstsBuffer,
  jstsBufferArea,
  jstsBufferRing,
} from './lib/fabrication/testing/jsts-reference';

/** Sewability internals the sewability benchmark times. */
export { preparePatches, searchSubset, OrderSearch, type SewabilityPatch } from './lib/sewability/index';

/** The print benchmark's recorder: a render's pen calls, written again with the pen alone or another writer. */
export { recordPenDrawing, replayWithPen, type PenCall, type PenRecording } from './lib/print/testing/pen-recorder';
export { embedFonts } from './lib/print/pdf-pen';
export { useFastFlate } from './lib/print/pdf-flate';

/** Forgets the sheet layout's cached searches, so the sheet-packing benchmark can time a first layout. */
export { clearLayoutCaches } from './lib/print/plan-print-layout';
