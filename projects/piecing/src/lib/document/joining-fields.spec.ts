import { describe, expect, it } from 'vitest';
import { parsePatternDocument } from './parse-pattern';
import type { PatternDocumentInput } from './pattern-schema';

/** A small two-section document without any of the issue-14 fields (as saved before they existed). */
const oldDocument = (): PatternDocumentInput => ({
  formatVersion: 2,
  title: 'Two squares',
  canvas: { widthIn: 8, heightIn: 4 },
  fabrics: [{ id: 'ink', name: 'Ink', colour: '#202040' }],
  sections: [
    {
      id: 'a',
      label: 'A',
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] },
      seams: [{ id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 4 } }],
      patches: [{ number: 1, anchor: { x: 1, y: 1 }, fabricId: 'ink' }],
    },
    { id: 'b', label: 'B', geometry: { kind: 'straight', vertices: [{ x: 4, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 4 }, { x: 4, y: 4 }] } },
  ],
});

function parse(doc: unknown) {
  const result = parsePatternDocument(doc);
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.document;
}

function issues(doc: unknown) {
  const result = parsePatternDocument(doc);
  return result.ok ? [] : result.issues;
}

describe('notes, joining plan, pressing, rough cuts and strip-set cuts in the document', () => {
  it('reads a document without them unchanged: no new keys appear', () => {
    const doc = parse(oldDocument());
    expect(doc.formatVersion).toBe(2);
    expect('notes' in doc).toBe(false);
    expect('joiningPlan' in doc).toBe(false);
    expect(Object.keys(doc.sections[0].seams[0]).sort()).toEqual(['a', 'b', 'id']);
    expect(Object.keys(doc.sections[0].patches[0]).sort()).toEqual(['anchor', 'fabricId', 'number']);
  });

  it('keeps every new field as written', () => {
    const input = oldDocument() as any;
    input.notes = 'Press the ring seams all one way so they nest.';
    input.joiningPlan = {
      steps: [
        { id: 'j1', kind: 'join', a: 'a', b: 'b', press: 'b' },
      ],
    };
    input.sections[0].seams[0].press = 'open';
    input.sections[0].patches[0].roughCut = { widthIn: 3, lengthIn: 4.5 };
    input.sections[0].patches[0].pieceTemplate = true;
    input.sections[0].patches.push({
      number: 2,
      anchor: { x: 3, y: 1 },
      stripSet: { id: 'plum-oat', name: 'Plum and oat', strips: [{ fabricId: 'ink', finishedWidthIn: 1 }, { fabricId: 'ink', finishedWidthIn: 1 }], subCutLengthIn: 2.5 },
    });
    const doc = parse(input);
    expect(doc.notes).toBe('Press the ring seams all one way so they nest.');
    expect(doc.joiningPlan?.steps).toEqual([{ id: 'j1', kind: 'join', a: 'a', b: 'b', press: 'b' }]);
    expect(doc.sections[0].seams[0].press).toBe('open');
    expect(doc.sections[0].patches[0].roughCut).toEqual({ widthIn: 3, lengthIn: 4.5 });
    expect(doc.sections[0].patches[0].pieceTemplate).toBe(true);
    expect(doc.sections[0].patches[1].stripSet?.subCutLengthIn).toBe(2.5);
    expect(doc.sections[0].patches[1].stripSet?.name).toBe('Plum and oat');
  });

  it('reads a ring step', () => {
    const input = oldDocument() as any;
    input.sections[1].ringRepeat = { count: 4, centre: { x: 8, y: 4 } };
    input.joiningPlan = { steps: [{ id: 'ring-b', kind: 'ring', sectionId: 'b', press: 'clockwise' }] };
    expect(parse(input).joiningPlan?.steps[0]).toEqual({ id: 'ring-b', kind: 'ring', sectionId: 'b', press: 'clockwise' });
  });

  it('names the path of each bad new field', () => {
    const bad = (change: (d: any) => void) => {
      const d = oldDocument() as any;
      change(d);
      return issues(d);
    };
    expect(bad((d) => (d.notes = 'x'.repeat(4001)))[0].path).toBe('notes');
    expect(bad((d) => (d.sections[0].seams[0].press = 'sideways'))[0].path).toBe('sections.0.seams.0.press');
    expect(bad((d) => (d.sections[0].patches[0].roughCut = { widthIn: 0, lengthIn: 3 }))[0]).toEqual({
      path: 'sections.0.patches.0.roughCut.widthIn',
      message: 'must be greater than zero',
    });
    expect(bad((d) => (d.joiningPlan = { steps: [{ id: 'j1', kind: 'join', a: 'a', b: 'b', press: 'up' }] }))[0].path).toBe('joiningPlan.steps.0.press');
    expect(bad((d) => (d.joiningPlan = { steps: [{ id: 'j1', kind: 'fold', a: 'a', b: 'b', press: 'a' }] }))[0].path).toBe('joiningPlan.steps.0.kind');
    expect(
      bad((d) => (d.joiningPlan = { steps: [{ id: 'j1', kind: 'join', a: 'a', b: 'b', press: 'a' }, { id: 'j1', kind: 'join', a: 'j1', b: 'b', press: 'a' }] })),
    ).toEqual([{ path: 'joiningPlan.steps.1.id', message: 'duplicate joining step id "j1"' }]);
    expect(bad((d) => (d.joiningPlan = { steps: [{ id: 'a', kind: 'join', a: 'a', b: 'b', press: 'a' }] }))).toEqual([
      { path: 'joiningPlan.steps.0.id', message: 'joining step id "a" is also a section id' },
    ]);
  });

  it('reads a plan naming a section that is not there (the joining check reports it, reading does not refuse it)', () => {
    const input = oldDocument() as any;
    input.joiningPlan = { steps: [{ id: 'j1', kind: 'join', a: 'a', b: 'gone', press: 'open' }] };
    expect(parse(input).joiningPlan?.steps[0]).toMatchObject({ b: 'gone' });
  });
});
