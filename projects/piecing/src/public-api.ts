/*
 * Public API of @seamwright/piecing: the pattern document, geometry, sewability, seam allowance,
 * cutting list and print sets. Import from '@seamwright/piecing' only, never from deep paths
 * (lint enforces it). An explicit list: what the editor, the app, the server and the command line
 * use, plus the document and its readers. Names that only tests and benchmarks need are in
 * './testing' ('@seamwright/piecing/testing'). To publish a name, add it to its group here.
 */

/** The pattern document: format version, zod schemas, types, reading and migrating, JSON Schema. */
export {
  FORMAT_VERSION,
  MAX_SIZE_IN,
  patternDocumentSchema,
  sectionGeometrySchema,
  arcGeometrySchema,
  wedgeGeometrySchema,
  parsePatternDocument,
  readPatternDocument,
  PatternValidationError,
  patternJsonSchemaText,
  type Point,
  type Fabric,
  type StraightGeometry,
  type ArcGeometry,
  type WedgeGeometry,
  type SectionGeometry,
  type SectionKind,
  type Seam,
  type Strip,
  type StripSet,
  type PatchAssignment,
  type RoughCut,
  type SeamPress,
  type JoinStepInput,
  type RingJoinStepInput,
  type PairJoinStepInput,
  type JoiningPlanInput,
  type RingRepeat,
  type Section,
  type ReferenceImage,
  type PatternDocument,
  type PatternDocumentInput,
  type DocumentIssue,
  type ParseResult,
  quiltLayoutSchema,
  colourwaySchema,
  type QuiltLayout,
  type QuiltLayoutInput,
  type QuiltSetting,
  type QuiltCell,
  type QuiltBorder,
  type QuiltSize,
  type Colourway,
  type ColourwayFabric,
} from './lib/document/index';

/** A quilter's own fabrics for a pattern (their colourway copy, design §11). */
export { applyFabricChoice, type FabricChoiceSlot } from './lib/quilt/fabric-choice';

/** From a block to a quilt (design §11): the quilt plan, sizes, colourways, the CLI's JSON. */
export {
  quiltPlan,
  quiltCliJson,
  quiltSizes,
  quiltBlockCount,
  applyColourway,
  defaultBlockSizeIn,
  blockDrawingBounds,
  cellTransform,
  quiltCentreSize,
  quiltPositions,
  settingTriangleCuts,
  borderCuts,
  bindingCuts,
  backingCuts,
  yardsToBuy,
  QuiltPlanError,
  type BlockBounds,
  type QuiltPlan,
  type QuiltPlanOptions,
  type QuiltPlanCell,
  type QuiltRect,
  type QuiltPolygon,
  type QuiltSettingTriangles,
  type QuiltSashing,
  type QuiltAlternateBlocks,
  type QuiltPlanBorder,
  type QuiltBinding,
  type QuiltBacking,
  type BackingSeams,
  type QuiltSettingPieceGroup,
  type QuiltFabricNeed,
  type QuiltSizeRow,
  type QuiltCliJson,
  type SizeIn,
  type AffineTransform,
} from './lib/quilt/index';
/** The finished quilt's picture as SVG text, for the app and the shop alike. */
export { blockPictureMarkup, quiltPictureSvg, type BlockWriter, type QuiltPictureSvgOptions } from './lib/quilt/quilt-picture-svg';

/** Resizing a whole design and finding sections outside the drawing area. */
export {
  resizeFactor,
  resizePattern,
  sectionsOutsideCanvas,
  type FinishedSize,
  type ResizeResult,
  type SectionOutsideCanvas,
} from './lib/document/index';

/** Geometry: vectors and angles, polygons, section outlines and edges, ring repeats, patches from seams. */
export {
  degToRad,
  radToDeg,
  distance,
  distanceToSegment,
  lerp,
  pointOnCircle,
  normaliseAngleDeg,
  polygonArea,
  polygonBounds,
  locatePoint,
  flattenSectionOutline,
  sectionEdges,
  ringRepeatTransforms,
  expandRingRepeat,
  circlesOfSections,
  edgesOnCircles,
  fitEdgeToCircle,
  splitSection,
  simplifyClosedRing,
  derivePatches,
  type Bounds,
  type DerivedPatch,
  type SplitResult,
} from './lib/geometry/index';

/** Sewability: whether a section can be sewn in order, and the order search. */
export {
  checkSewability,
  findSewableOrder,
  type SewabilityVerdict,
  type SewableOrderResult,
  type SewabilityOptions,
} from './lib/sewability/index';

/** The joining plan: sections into units and units into the block; pressing inside a section. */
export {
  defaultJoiningPlan,
  resolveJoiningPlan,
  checkJoiningPlan,
  seamPressing,
  type JoiningPlan,
  type JoinPart,
  type JoinSeam,
  type JoinPress,
  type ResolvedJoinStep,
  type ResolvedJoiningPlan,
  type JoiningProblem,
  type JoiningProblemKind,
  type SeamPressing,
  type JoiningDocument,
} from './lib/joining/index';

/** Fabrication: cutting lines, strip sets, the cutting list and template copies. */
export {
  sectionCuttingLine,
  layoutStripSet,
  stripSetBands,
  stripSetDisplayName,
  stripSetListName,
  fitRoughCut,
  buildCuttingList,
  planCopies,
  foundationCopies,
  pieceTemplateCopies,
  copiesRuleText,
  INCHES_PER_YARD,
  YARDAGE_STEP_IN,
  type StripSetLayout,
  type StripBand,
  type CuttingList,
  type CuttingListStripSet,
  type RoughCutFit,
  type CopyPlan,
  type SectionCopies,
  type PieceTemplateCopies,
  type PieceTemplateReason,
} from './lib/fabrication/index';

/** Print sets: paper, options and fonts, the layout plan and the PDF. */
export {
  PAPER_NAMES,
  PAPER_SIZES,
  TEST_SQUARE_IN,
  TEST_SQUARE_CM_IN,
  printOptionsSchema,
  loadPrintFonts,
  buildPrintTemplates,
  layoutTemplates,
  planPrintLayout,
  renderPrintSet,
  findUnsewableSections,
  unsewableStatement,
  UnsewablePatternError,
  finishedBlockSize,
  quiltPrintDocument,
  quiltPrintIssues,
  buildPieceTemplates,
  type UnsewableSection,
  type FinishedBlockSize,
  type PieceTemplate,
  sheetCountStatement,
  type PaperName,
  type PrintOptions,
  type PrintOptionsInput,
  type PrintFonts,
  type PrintTemplate,
  type PrintLayout,
  type PlannedSheet,
  type SheetPlacement,
  type PrintSetResult,
  type PrintProgress,
  type RenderPrintSetOptions,
} from './lib/print/index';

/** Lengths as people write and read them. */
export {
  CM_PER_INCH,
  parseLength,
  formatInches,
  formatCentimetres,
  formatLength,
  type LengthUnit,
  type InchDenominator,
} from './lib/units/index';

/** The demo patterns (invented, docs/design-notes.md#demo-data). */
export { buildOrchardWheel, buildGardenGate } from './lib/demo/index';
