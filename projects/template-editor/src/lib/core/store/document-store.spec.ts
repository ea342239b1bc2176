import { describe, expect, it } from 'vitest';
import { emptyPattern } from '../testing/board-fixtures';
import { differs, DocumentStore } from './document-store';

describe('DocumentStore', () => {
  it('tells documents apart by value, an absent key being the same as an undefined one', () => {
    const shared = { x: 1, list: [1, 2, { y: 'a' }] };
    expect(differs({ a: shared, b: 2 }, { a: shared, b: 2 })).toBe(false);
    expect(differs({ a: { x: 1, list: [1, 2, { y: 'a' }] } }, { a: { x: 1, list: [1, 2, { y: 'a' }] } })).toBe(false);
    expect(differs({ a: { x: 1, list: [1, 2, { y: 'a' }] } }, { a: { x: 1, list: [1, 2, { y: 'b' }] } })).toBe(true);
    expect(differs({ a: [1, 2] }, { a: [1, 2, 3] })).toBe(true);
    expect(differs({ a: 1, b: undefined }, { a: 1 })).toBe(false);
    expect(differs({ a: 1 }, { a: 1, c: 0 })).toBe(true);
    expect(differs({ a: [] }, { a: {} })).toBe(true);
    expect(differs({ a: null }, { a: {} })).toBe(true);
  });

  it('records each command as one step and loading as none', () => {
    const doc = emptyPattern();
    const store = new DocumentStore(doc);
    const origins: string[] = [];
    store.subscribe((s) => origins.push(s.origin));
    store.apply('Rename', (d) => ({ ...d, title: 'Renamed' }));
    expect(store.document.title).toBe('Renamed');
    expect(store.dirty).toBe(true);
    expect(store.undoDepth).toBe(1);
    store.undo();
    expect(store.document.title).toBe('Test wheel');
    expect(store.dirty).toBe(false);
    store.redo();
    expect(store.document.title).toBe('Renamed');
    store.load({ ...doc, title: 'From the server' });
    expect(store.canUndo).toBe(false);
    expect(store.canRedo).toBe(false);
    expect(store.dirty).toBe(false);
    expect(origins).toEqual(['command', 'undo', 'redo', 'load']);
  });

  it('makes a whole gesture one undo step, and a cancelled gesture leaves nothing', () => {
    const store = new DocumentStore(emptyPattern());
    store.beginGesture('Drag');
    for (let i = 1; i <= 20; i++) store.apply('Drag', (d) => ({ ...d, blockCount: i }));
    store.endGesture();
    expect(store.document.blockCount).toBe(20);
    expect(store.undoDepth).toBe(1);
    store.undo();
    expect(store.document.blockCount).toBe(1);
    store.beginGesture('Drag');
    store.apply('Drag', (d) => ({ ...d, blockCount: 7 }));
    store.cancelGesture();
    expect(store.document.blockCount).toBe(1);
    expect(store.canUndo).toBe(false);
    expect(store.canRedo).toBe(true);
  });

  it('marks the document saved and keeps the selection valid after undo', () => {
    const store = new DocumentStore(emptyPattern());
    store.apply('Title', (d) => ({ ...d, title: 'One' }));
    store.markSaved();
    expect(store.dirty).toBe(false);
    store.apply('Title', (d) => ({ ...d, title: 'Two' }));
    expect(store.dirty).toBe(true);
    store.select({ sectionId: 'gone', patchIndex: 2 });
    store.undo();
    expect(store.dirty).toBe(false);
    expect(store.selection).toEqual({ sectionId: null, patchIndex: null });
  });
});
