import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parsePatternDocument, PatternValidationError, readPatternDocument } from './parse-pattern';
import type { PatternDocumentInput } from './pattern-schema';

const valid = (): PatternDocumentInput => ({
  formatVersion: 1,
  title: 'Test block',
  canvas: { widthIn: 8, heightIn: 8 },
  fabrics: [{ id: 'ink', name: 'Ink', colour: '#202040' }],
  sections: [
    {
      id: 'a',
      label: 'A',
      geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] },
      seams: [{ id: 's1', a: { x: 2, y: 0 }, b: { x: 2, y: 4 } }],
      patches: [{ number: 1, anchor: { x: 1, y: 1 }, fabricId: 'ink' }],
    },
    { id: 'b', label: 'B', geometry: { kind: 'arc', centre: { x: 4, y: 4 }, innerRadiusIn: 2, outerRadiusIn: 3, startAngleDeg: 0, sweepDeg: 90 } },
  ],
});

/** Parses a changed copy of the valid document and returns its issues. */
function issuesOf(change: (doc: any) => void) {
  const doc = structuredClone(valid()) as any;
  change(doc);
  const result = parsePatternDocument(doc);
  return result.ok ? [] : result.issues;
}

describe('parsePatternDocument', () => {
  it('accepts a valid document and fills the defaults', () => {
    const result = parsePatternDocument(valid());
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.document.seamAllowanceIn).toBe(0.25);
    expect(result.document.displayUnit).toBe('in');
    expect(result.document.fabrics[0].usableWofIn).toBe(42);
    expect(result.document.sections[1].seams).toEqual([]);
  });

  it('names the path of each bad field', () => {
    expect(issuesOf((d) => (d.sections[1].geometry.sweepDeg = 0))).toEqual([{ path: 'sections.1.geometry.sweepDeg', message: 'must be at least 0.01° and at most 360°' }]);
    expect(issuesOf((d) => (d.sections[1].geometry.sweepDeg = 360.5))[0].path).toBe('sections.1.geometry.sweepDeg');
    expect(issuesOf((d) => (d.sections[1].geometry.innerRadiusIn = 3))).toEqual([{ path: 'sections.1.geometry.innerRadiusIn', message: 'inner radius must be smaller than outer radius' }]);
    expect(issuesOf((d) => (d.sections[1].geometry.outerRadiusIn = -1)).map((i) => i.path)).toContain('sections.1.geometry.outerRadiusIn');
    expect(issuesOf((d) => (d.sections[1].geometry.innerRadiusIn = 0))[0]).toEqual({ path: 'sections.1.geometry.innerRadiusIn', message: 'must be greater than zero' });
    expect(issuesOf((d) => (d.sections[0].geometry.vertices[2].x = 250))[0]).toEqual({ path: 'sections.0.geometry.vertices.2.x', message: 'must be within ±200 in.' });
    expect(issuesOf((d) => (d.sections[0].seams[0].a.y = Number.NaN))[0].path).toBe('sections.0.seams.0.a.y');
    expect(issuesOf((d) => (d.sections[0].seams[0].a.y = Infinity))[0].path).toBe('sections.0.seams.0.a.y');
    expect(issuesOf((d) => (d.sections[1].geometry.outerRadiusIn = 201))[0]).toEqual({ path: 'sections.1.geometry.outerRadiusIn', message: 'must be at most 200 in.' });
    expect(issuesOf((d) => (d.sections[0].patches[0].fabricId = 'plum'))).toEqual([{ path: 'sections.0.patches.0.fabricId', message: 'unknown fabric "plum"' }]);
    expect(issuesOf((d) => (d.sections[1].label = 'A'))).toEqual([{ path: 'sections.1.label', message: 'duplicate section label "A"' }]);
    expect(issuesOf((d) => (d.sections[1].geometry.kind = 'oval'))[0].path).toBe('sections.1.geometry.kind');
    expect(issuesOf((d) => (d.fabrics[0].colour = 'plum'))[0]).toEqual({ path: 'fabrics.0.colour', message: 'must be a colour like #7a3b69' });
  });

  it('rejects a self-crossing outline with the coordinates of the crossing', () => {
    const issues = issuesOf((d) => {
      d.sections[0].geometry.vertices = [{ x: 0, y: 0 }, { x: 4, y: 4 }, { x: 4, y: 0 }, { x: 0, y: 4 }];
    });
    expect(issues).toHaveLength(1);
    expect(issues[0].path).toBe('sections.0.geometry.vertices');
    expect(issues[0].message).toBe('outline crosses itself at (2, 2): edge (0, 0)–(4, 4) meets edge (4, 0)–(0, 4)');
  });

  it('rejects an outline with no area and a seam with no length', () => {
    expect(issuesOf((d) => (d.sections[0].geometry.vertices = [{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }]))[0]).toEqual({
      path: 'sections.0.geometry.vertices',
      message: 'outline has no area: its vertices lie on one line or repeat',
    });
    expect(issuesOf((d) => (d.sections[0].seams[0].b = { x: 2, y: 0 }))).toEqual([{ path: 'sections.0.seams.0', message: 'seam "s1" has no length: both ends at (2, 0)' }]);
  });

  it('rejects an arc or wedge that reaches past the size limit', () => {
    expect(issuesOf((d) => (d.sections[1].geometry.centre = { x: 150, y: 10 }))).toEqual([]);
    expect(issuesOf((d) => {
      d.sections[1].geometry.centre = { x: 198, y: 10 };
    })).toEqual([{ path: 'sections.1.geometry.outerRadiusIn', message: 'a circle of radius 3 in. about (198, 10) reaches 201 in. from the origin, beyond the ±200 in. limit' }]);
  });

  it('explains a wrong or future format version and a non-object', () => {
    expect(issuesOf((d) => (d.formatVersion = 3))).toEqual([{ path: 'formatVersion', message: 'version 3 is newer than this program reads (2)' }]);
    expect(issuesOf((d) => delete d.formatVersion)[0].path).toBe('formatVersion');
    expect(parsePatternDocument([])).toEqual({ ok: false, issues: [{ path: '', message: 'a pattern document must be a JSON object' }] });
    expect(() => readPatternDocument({ formatVersion: 1 })).toThrow(PatternValidationError);
  });

  it('property: never throws, whatever it is given', () => {
    fc.assert(
      fc.property(fc.oneof(fc.anything(), fc.jsonValue(), fc.record({ formatVersion: fc.constant(1), title: fc.string(), sections: fc.array(fc.anything()) })), (raw) => {
        const result = parsePatternDocument(raw);
        expect(typeof result.ok).toBe('boolean');
      }),
      { numRuns: 300 },
    );
  });
});
