import { describe, expect, it } from 'vitest';
import { setReferenceImage } from '../commands/reference-image';
import { DocumentStore } from '../store/document-store';
import { emptyPattern } from '../testing/board-fixtures';
import { ReferenceScaleTool } from './reference-scale.tool';

function withImage() {
  const store = new DocumentStore(setReferenceImage(emptyPattern(), 'up1', { origin: { x: 1, y: 2 }, widthIn: 10 }));
  return { store, tool: new ReferenceScaleTool({ store }) };
}

describe('Trace image scale tool', () => {
  it('picks two points, then the typed distance scales the image about the first point in one undo step', () => {
    const { store, tool } = withImage();
    expect(tool.state).toBe('idle');
    tool.pointerDown({ point: { x: 3, y: 4 } });
    tool.pointerUp({ point: { x: 3, y: 4 } });
    expect(tool.state).toBe('second');
    tool.pointerMove({ point: { x: 5, y: 5 } });
    expect(tool.preview()).toEqual({ kind: 'polyline', points: [{ x: 3, y: 4 }, { x: 5, y: 5 }], closed: false });
    tool.pointerDown({ point: { x: 7, y: 7 } });
    expect(tool.state).toBe('measured');
    expect(tool.shownDistanceIn).toBeCloseTo(5, 12);

    // 5 in. on the image is really 10 in.: width 10 → 20, origin (1, 2) → (3, 4) − (2, 2)·2 = (−1, 0).
    expect(tool.applyDistance(10)).toBe(true);
    const ref = store.document.referenceImage!;
    expect(ref.widthIn).toBeCloseTo(20, 12);
    expect(ref.origin.x).toBeCloseTo(-1, 12);
    expect(ref.origin.y).toBeCloseTo(0, 12);
    expect(store.undoDepth).toBe(1);
    expect(tool.state).toBe('idle');
    store.undo();
    expect(store.document.referenceImage).toEqual({ uploadId: 'up1', origin: { x: 1, y: 2 }, widthIn: 10, opacity: 0.4 });
  });

  it('Escape starts over; without an image there is nothing to pick', () => {
    const { tool } = withImage();
    tool.pointerDown({ point: { x: 3, y: 4 } });
    expect(tool.key('Escape')).toBe(true);
    expect(tool.state).toBe('idle');
    expect(tool.preview()).toBeNull();
    expect(tool.key('Escape')).toBe(false);

    const bare = new ReferenceScaleTool({ store: new DocumentStore(emptyPattern()) });
    bare.pointerDown({ point: { x: 1, y: 1 } });
    expect(bare.state).toBe('idle');
    expect(bare.applyDistance(3)).toBe(false);
  });

  it('a distance that changes nothing keeps the points for another try', () => {
    const { store, tool } = withImage();
    tool.pointerDown({ point: { x: 3, y: 4 } });
    tool.pointerDown({ point: { x: 7, y: 7 } });
    expect(tool.applyDistance(5)).toBe(false);
    expect(tool.state).toBe('measured');
    expect(store.canUndo).toBe(false);
  });
});
