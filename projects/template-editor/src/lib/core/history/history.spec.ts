import { describe, expect, it } from 'vitest';
import { applyDiff, diffValues } from './document-diff';
import { History } from './history';

describe('document diffs', () => {
  it('records only the changed leaves of structurally shared values', () => {
    const shared = { big: Array.from({ length: 100 }, (_, i) => ({ i })) };
    const before = { title: 'a', shared, sections: [{ id: 's1', x: 1 }, { id: 's2', x: 2 }] };
    const after = { ...before, sections: [before.sections[0], { ...before.sections[1], x: 5 }] };
    const diff = diffValues(before, after);
    expect(diff).toEqual([{ path: ['sections', 1, 'x'], before: 2, after: 5 }]);
    expect(applyDiff(after, diff, 'undo')).toEqual(before);
    expect(applyDiff(before, diff, 'redo')).toEqual(after);
  });

  it('replaces arrays whose length changed and removes keys that went away', () => {
    const before: Record<string, unknown> = { list: [1, 2], note: 'x' };
    const after: Record<string, unknown> = { list: [1, 2, 3] };
    const diff = diffValues(before, after);
    expect(diff).toHaveLength(2);
    expect(applyDiff(after, diff, 'undo')).toEqual(before);
    const redone = applyDiff(before, diff, 'redo');
    expect(redone).toEqual(after);
    expect('note' in redone).toBe(false);
  });

  it('finds no difference between equal values', () => {
    expect(diffValues({ a: [1, { b: 2 }] }, { a: [1, { b: 2 }] })).toEqual([]);
  });
});

describe('History', () => {
  it('undoes and redoes steps in order and drops the redo branch on a new step', () => {
    const h = new History<{ n: number }>();
    const v0 = { n: 0 };
    const v1 = { n: 1 };
    const v2 = { n: 2 };
    expect(h.record('one', v0, v1)).toBe(true);
    expect(h.record('two', v1, v2)).toBe(true);
    expect(h.record('nothing', v2, { n: 2 })).toBe(false);
    expect(h.undoLabel).toBe('two');
    const u1 = h.undo(v2)!;
    expect(u1).toEqual(v1);
    expect(h.undo(u1)).toEqual(v0);
    expect(h.undo(v0)).toBeNull();
    expect(h.redo(v0)).toEqual(v1);
    h.record('three', v1, { n: 3 });
    expect(h.canRedo).toBe(false);
    expect(h.depth).toBe(2);
  });
});
