import { buildCuttingList, buildGardenGate, buildOrchardWheel, derivePatches, polygonArea, readPatternDocument, type PatternDocument } from '@seamwright/piecing';
import { describe, expect, it } from 'vitest';
import { DocumentStore } from '../store/document-store';
import { emptyPattern } from '../testing/board-fixtures';
import {
  addFabric,
  fabricChangeProblem,
  fabricUses,
  newFabric,
  patternStripSets,
  removeFabric,
  renameStripSet,
  resizeDesign,
  setSewingSettings,
  updateFabric,
} from './pattern-settings';

/** A 24 in. pattern whose one section uses Plum as a fill and Oat in a strip set; Sage is unused. */
function withUses(): PatternDocument {
  return readPatternDocument({
    ...emptyPattern(),
    sections: [
      {
        id: 'sq',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] },
        seams: [{ id: 's1', a: { x: 3, y: -0.1 }, b: { x: 3, y: 6.1 } }],
        patches: [
          { number: 1, anchor: { x: 1.5, y: 3 }, fabricId: 'plum' },
          { number: 2, anchor: { x: 4.5, y: 3 }, stripSet: { id: 't-x81', strips: [{ fabricId: 'oat', finishedWidthIn: 2 }, { fabricId: 'plum', finishedWidthIn: 4 }] } },
        ],
      },
    ],
  });
}

describe('fabrics', () => {
  it('adds a fabric with the next free name and a colour not yet used', () => {
    const doc = emptyPattern();
    const f = newFabric(doc, 'f-new');
    expect(f).toEqual({ id: 'f-new', name: 'Fabric 4', colour: '#c4622d', usableWofIn: 42 });
    const after = addFabric(doc, f);
    expect(after.fabrics.map((x) => x.name)).toEqual(['Plum', 'Oat', 'Sage', 'Fabric 4']);
    expect(addFabric(after, f)).toBe(after); // the same id twice is refused
    expect(readPatternDocument(after).fabrics).toHaveLength(4); // still a valid document
  });

  it('renames, recolours and changes the usable width, refusing what the format does not take', () => {
    const doc = emptyPattern();
    const next = updateFabric(doc, 'oat', { name: '  Oatmeal ', colour: '#AABBCC', usableWofIn: 40.5 });
    expect(next.fabrics[1]).toEqual({ id: 'oat', name: 'Oatmeal', colour: '#aabbcc', usableWofIn: 40.5 });
    expect(fabricChangeProblem(doc, 'oat', { name: ' ' })).toBe('a fabric needs a name');
    expect(fabricChangeProblem(doc, 'oat', { name: 'plum' })).toBe('another fabric is called plum');
    expect(fabricChangeProblem(doc, 'oat', { colour: 'red' })).toBe('a colour is written like #7a3b69');
    expect(fabricChangeProblem(doc, 'oat', { usableWofIn: 0 })).toMatch(/more than 0/);
    for (const bad of [{ name: '' }, { colour: '#abc' }, { usableWofIn: -1 }, { usableWofIn: 201 }]) expect(updateFabric(doc, 'oat', bad)).toBe(doc);
    expect(updateFabric(doc, 'oat', { name: 'Oat' })).toBe(doc); // no change, no undo step
  });

  it('removes only a fabric no patch or strip uses', () => {
    const doc = withUses();
    expect(fabricUses(doc, 'plum')).toEqual(['A1', 'A2']);
    expect(fabricUses(doc, 'oat')).toEqual(['A2']);
    expect(fabricUses(doc, 'sage')).toEqual([]);
    expect(removeFabric(doc, 'plum')).toBe(doc);
    expect(removeFabric(doc, 'oat')).toBe(doc);
    expect(removeFabric(doc, 'sage').fabrics.map((f) => f.id)).toEqual(['plum', 'oat']);
  });
});

describe('sewing settings', () => {
  it('sets allowance, margin, blocks and pressings within the format ranges', () => {
    const doc = emptyPattern();
    const next = setSewingSettings(doc, { seamAllowanceIn: 0.375, piecingMarginIn: 0, blockCount: 12, pressingsPerTemplate: 20 });
    expect([next.seamAllowanceIn, next.piecingMarginIn, next.blockCount, next.pressingsPerTemplate]).toEqual([0.375, 0, 12, 20]);
    expect(readPatternDocument(next).blockCount).toBe(12);
    for (const bad of [{ seamAllowanceIn: 0 }, { piecingMarginIn: 4.5 }, { blockCount: 2.5 }, { pressingsPerTemplate: 0 }, { blockCount: Number.NaN }]) {
      expect(setSewingSettings(doc, bad)).toBe(doc);
    }
    expect(setSewingSettings(doc, { blockCount: 1 })).toBe(doc);
  });
});

describe('strip set names', () => {
  it('lists every strip set with where it is and names it', () => {
    const doc = withUses();
    expect(patternStripSets(doc)).toEqual([{ stripSetId: 't-x81', name: null, sectionLabels: ['A'], patchLabels: ['A2'] }]);
    const named = renameStripSet(doc, 't-x81', '  Dawn stripes ');
    expect(named.sections[0].patches[1].stripSet?.name).toBe('Dawn stripes');
    expect(buildCuttingList(named).stripSets[0].name).toBe('Dawn stripes');
    expect(renameStripSet(named, 't-x81', 'Dawn stripes')).toBe(named);
    expect(renameStripSet(named, 't-x81', '').sections[0].patches[1].stripSet).not.toHaveProperty('name');
    expect(renameStripSet(doc, 't-x81', 'x'.repeat(81))).toBe(doc);
  });
});

describe('resize as an undoable step', () => {
  /** Patch areas by label, arcs flattened at `toleranceIn`. */
  const areas = (d: PatternDocument, toleranceIn: number) => new Map(d.sections.flatMap((s) => derivePatches(s, { toleranceIn }).patches.map((p) => [p.label, polygonArea(p.polygon)] as const)));

  it('scales every patch area by k² and the cutting list follows; undo brings the old size back', () => {
    const doc = readPatternDocument(buildOrchardWheel());
    const store = new DocumentStore(doc);
    const k = 20 / 26;
    store.apply('Resize design', (d) => resizeDesign(d, { widthIn: 20, heightIn: 20 }));
    const resized = store.document;
    expect(resized.canvas).toEqual({ widthIn: 20, heightIn: 20 });
    expect(resized.seamAllowanceIn).toBe(doc.seamAllowanceIn);
    const before = areas(doc, 0.002);
    const after = areas(resized, 0.002 * k);
    // Area scales as the square of length under a similarity (standard mensuration).
    for (const [label, a] of before) expect(after.get(label)! / a, label).toBeCloseTo(k * k, 7);
    // The cutting list is worked out again: every strip finishes k times as wide and is cut with the same ¼ in. allowance.
    const listBefore = buildCuttingList(doc);
    const listAfter = buildCuttingList(resized);
    expect(listAfter.seamAllowanceIn).toBe(listBefore.seamAllowanceIn);
    listAfter.stripSets.forEach((s, i) =>
      s.strips.forEach((st, j) => {
        expect(st.finishedWidthIn).toBeCloseTo(listBefore.stripSets[i].strips[j].finishedWidthIn * k, 9);
        expect(st.cutWidthIn).toBeCloseTo(st.finishedWidthIn + 2 * doc.seamAllowanceIn, 9);
      }),
    );
    expect(listAfter.totalYardageIn).toBeLessThan(listBefore.totalYardageIn);
    expect(store.undo()).toBe(true);
    expect(store.document).toEqual(doc);
  });

  it('fits a design into a size out of proportion by the smaller ratio, and refuses one the format cannot hold', () => {
    const doc = buildGardenGate();
    const wide = resizeDesign(doc, { widthIn: 16, heightIn: 12 });
    expect(wide.canvas).toEqual({ widthIn: 16, heightIn: 12 });
    expect(wide.sections[0].geometry).toEqual({ kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 12, y: 0 }, { x: 12, y: 4.5 }, { x: 0, y: 4.5 }] });
    expect(resizeDesign(doc, { widthIn: 8, heightIn: 8 })).toBe(doc);
    // Told its area is 1 in., the 8 in. gate would be 1,600 in. across at 200×: refused, nothing changes.
    const tiny = { ...doc, canvas: { widthIn: 1, heightIn: 1 } };
    expect(resizeDesign(tiny, { widthIn: 200, heightIn: 200 })).toBe(tiny);
  });
});
