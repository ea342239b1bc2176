import { MAX_SIZE_IN, type PatternDocument, type Point, type ReferenceImage } from '@seamwright/piecing';

/*
 * Commands on the trace image (the document's `referenceImage`): pure functions from a document to a
 * new document, each one undo step when run through the store. A command that changes nothing
 * returns the document itself, so the store records no step.
 */

/** Opacity a newly traced image starts with. */
export const DEFAULT_REFERENCE_OPACITY = 0.4;

/** Shortest distance between the two picked points, in inches, that still sets a scale. */
export const MIN_SCALE_SPAN_IN = 0.01;

/** Narrowest trace image a scale may give, in inches; the widest is the pattern format's size limit. */
const MIN_WIDTH_IN = 0.1;

/** Puts an image under the drawing (replacing any other); it starts as wide as the drawing area. */
export function setReferenceImage(
  document: PatternDocument,
  uploadId: string,
  place: Partial<Omit<ReferenceImage, 'uploadId'>> = {},
): PatternDocument {
  const referenceImage: ReferenceImage = {
    uploadId,
    origin: place.origin ?? { x: 0, y: 0 },
    widthIn: place.widthIn ?? document.canvas.widthIn,
    opacity: clampOpacity(place.opacity ?? DEFAULT_REFERENCE_OPACITY),
  };
  return { ...document, referenceImage };
}

/** Moves the image by (dx, dy) inches. */
export function moveReferenceImage(document: PatternDocument, dx: number, dy: number): PatternDocument {
  const ref = document.referenceImage;
  if (!ref || !Number.isFinite(dx) || !Number.isFinite(dy) || (dx === 0 && dy === 0)) return document;
  return withImage(document, { ...ref, origin: { x: ref.origin.x + dx, y: ref.origin.y + dy } });
}

/** Places the image's top-left corner at `origin` (inches). */
export function placeReferenceImage(document: PatternDocument, origin: Point): PatternDocument {
  const ref = document.referenceImage;
  if (!ref || !Number.isFinite(origin.x) || !Number.isFinite(origin.y)) return document;
  return moveReferenceImage(document, origin.x - ref.origin.x, origin.y - ref.origin.y);
}

/** Sets the image's opacity (clamped to 0…1). */
export function setReferenceOpacity(document: PatternDocument, opacity: number): PatternDocument {
  const ref = document.referenceImage;
  if (!ref || !Number.isFinite(opacity)) return document;
  const next = clampOpacity(opacity);
  return next === ref.opacity ? document : withImage(document, { ...ref, opacity: next });
}

/**
 * Scales the image so that two points picked on it, `p` and `q` (document inches, where the image
 * shows them now), end up `distanceIn` apart, keeping `p` where it is on the page.
 *
 * The image is drawn at `origin` with width `widthIn` and its height in proportion, so a point of the
 * image sits at `origin + u · widthIn` for its place `u` on the image (a fraction of its width, the
 * same on both axes). Scaling by k = distanceIn / |pq| gives widthIn' = widthIn · k; keeping p fixed,
 * `origin' + u_p · widthIn' = p` with `u_p = (p − origin) / widthIn`, so `origin' = p − (p − origin) · k`.
 * Every other point of the image then moves k times as far from p as it was: q' − p = (q − p) · k,
 * whose length is |pq| · k = distanceIn.
 */
export function scaleReferenceImage(document: PatternDocument, p: Point, q: Point, distanceIn: number): PatternDocument {
  const ref = document.referenceImage;
  const span = Math.hypot(q.x - p.x, q.y - p.y);
  if (!ref || !Number.isFinite(distanceIn) || distanceIn <= 0 || !(span >= MIN_SCALE_SPAN_IN)) return document;
  const k = distanceIn / span;
  const widthIn = ref.widthIn * k;
  if (widthIn < MIN_WIDTH_IN || widthIn > MAX_SIZE_IN || k === 1) return document;
  const origin = { x: p.x - (p.x - ref.origin.x) * k, y: p.y - (p.y - ref.origin.y) * k };
  return withImage(document, { ...ref, origin, widthIn });
}

/** Takes the image away (the upload stays on the server; undo puts it back). */
export function removeReferenceImage(document: PatternDocument): PatternDocument {
  if (!document.referenceImage) return document;
  const next = { ...document };
  delete next.referenceImage;
  return next;
}

function withImage(document: PatternDocument, referenceImage: ReferenceImage): PatternDocument {
  return { ...document, referenceImage };
}

function clampOpacity(opacity: number): number {
  return Math.min(1, Math.max(0, opacity));
}
