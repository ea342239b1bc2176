import { describe, expect, it } from 'vitest';
import type { PatternDocument } from '@seamwright/piecing';
import { DocumentStore } from '../store/document-store';
import { emptyPattern } from '../testing/board-fixtures';
import {
  moveReferenceImage,
  placeReferenceImage,
  removeReferenceImage,
  scaleReferenceImage,
  setReferenceImage,
  setReferenceOpacity,
} from './reference-image';

/** The empty 24 × 24 in. test pattern with an image at (1, 2), 10 in. wide, at 40 %. */
function traced(): PatternDocument {
  return setReferenceImage(emptyPattern(), 'up1', { origin: { x: 1, y: 2 }, widthIn: 10, opacity: 0.4 });
}

describe('trace image commands', () => {
  it('setReferenceImage puts a new image as wide as the drawing area at the top-left corner, 40 % opaque', () => {
    const doc = setReferenceImage(emptyPattern(), 'up7');
    expect(doc.referenceImage).toEqual({ uploadId: 'up7', origin: { x: 0, y: 0 }, widthIn: 24, opacity: 0.4 });
  });

  it('moveReferenceImage shifts the origin by (dx, dy) and nothing else', () => {
    const doc = moveReferenceImage(traced(), 0.125, -0.25);
    expect(doc.referenceImage).toEqual({ uploadId: 'up1', origin: { x: 1.125, y: 1.75 }, widthIn: 10, opacity: 0.4 });
  });

  it('placeReferenceImage sets the origin', () => {
    expect(placeReferenceImage(traced(), { x: -3, y: 4.5 }).referenceImage?.origin).toEqual({ x: -3, y: 4.5 });
  });

  it('setReferenceOpacity keeps the value within 0…1', () => {
    expect(setReferenceOpacity(traced(), 0.75).referenceImage?.opacity).toBe(0.75);
    expect(setReferenceOpacity(traced(), 1.6).referenceImage?.opacity).toBe(1);
    expect(setReferenceOpacity(traced(), -2).referenceImage?.opacity).toBe(0);
  });

  it('scaleReferenceImage: p (3, 4) and q (7, 7) are 5 in. apart on the image; typed 10 in. doubles it about p', () => {
    // k = 10 / 5 = 2: width 10 → 20; origin' = p − (p − origin)·k = (3, 4) − (2, 2)·2 = (−1, 0).
    const before = traced();
    const doc = scaleReferenceImage(before, { x: 3, y: 4 }, { x: 7, y: 7 }, 10);
    const ref = doc.referenceImage!;
    expect(ref.widthIn).toBeCloseTo(20, 12);
    expect(ref.origin.x).toBeCloseTo(-1, 12);
    expect(ref.origin.y).toBeCloseTo(0, 12);
    // Where the image's points land now: p stays, q lands 10 in. from p.
    const land = (pt: { x: number; y: number }) => {
      const old = before.referenceImage!;
      const u = { x: (pt.x - old.origin.x) / old.widthIn, y: (pt.y - old.origin.y) / old.widthIn };
      return { x: ref.origin.x + u.x * ref.widthIn, y: ref.origin.y + u.y * ref.widthIn };
    };
    expect(land({ x: 3, y: 4 }).x).toBeCloseTo(3, 12);
    expect(land({ x: 3, y: 4 }).y).toBeCloseTo(4, 12);
    const q = land({ x: 7, y: 7 });
    expect(q.x).toBeCloseTo(11, 12);
    expect(q.y).toBeCloseTo(10, 12);
    expect(Math.hypot(q.x - 3, q.y - 4)).toBeCloseTo(10, 12);
  });

  it('scaleReferenceImage shrinks too: two points 4 in. apart typed as 1 in.', () => {
    // k = 1 / 4: width 10 → 2.5; origin' = (5, 6) − ((5, 6) − (1, 2))·¼ = (4, 5).
    const doc = scaleReferenceImage(traced(), { x: 5, y: 6 }, { x: 5, y: 10 }, 1);
    expect(doc.referenceImage?.widthIn).toBeCloseTo(2.5, 12);
    expect(doc.referenceImage?.origin.x).toBeCloseTo(4, 12);
    expect(doc.referenceImage?.origin.y).toBeCloseTo(5, 12);
  });

  it('scaleReferenceImage leaves the document alone for coincident points, a zero distance, or a width past the limit', () => {
    const doc = traced();
    expect(scaleReferenceImage(doc, { x: 3, y: 4 }, { x: 3, y: 4.001 }, 2)).toBe(doc);
    expect(scaleReferenceImage(doc, { x: 3, y: 4 }, { x: 7, y: 7 }, 0)).toBe(doc);
    expect(scaleReferenceImage(doc, { x: 3, y: 4 }, { x: 7, y: 7 }, 5)).toBe(doc);
    expect(scaleReferenceImage(doc, { x: 0, y: 0 }, { x: 1, y: 0 }, 100)).toBe(doc);
  });

  it('removeReferenceImage drops the field; every command leaves a document without an image alone', () => {
    const doc = removeReferenceImage(traced());
    expect('referenceImage' in doc).toBe(false);
    expect(moveReferenceImage(doc, 1, 1)).toBe(doc);
    expect(setReferenceOpacity(doc, 0.5)).toBe(doc);
    expect(scaleReferenceImage(doc, { x: 0, y: 0 }, { x: 1, y: 0 }, 2)).toBe(doc);
    expect(removeReferenceImage(doc)).toBe(doc);
  });

  it('each command is one undo step in the store, and undo walks back through them in order', () => {
    const store = new DocumentStore(emptyPattern());
    store.apply('Trace image', (d) => setReferenceImage(d, 'up1'));
    store.apply('Move trace image', (d) => moveReferenceImage(d, 0.125, 0));
    store.apply('Trace image opacity', (d) => setReferenceOpacity(d, 0.8));
    store.apply('Remove trace image', removeReferenceImage);
    expect(store.undoDepth).toBe(4);
    expect(store.document.referenceImage).toBeUndefined();
    store.undo();
    expect(store.document.referenceImage?.opacity).toBe(0.8);
    store.undo();
    expect(store.document.referenceImage?.opacity).toBe(0.4);
    expect(store.document.referenceImage?.origin.x).toBe(0.125);
    store.undo();
    expect(store.document.referenceImage?.origin.x).toBe(0);
    store.undo();
    expect(store.document.referenceImage).toBeUndefined();
    expect(store.canUndo).toBe(false);
  });
});
