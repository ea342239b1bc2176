import { describe, expect, it } from 'vitest';
import { curvedCornerDocument } from '../geometry/testing/curved-corner';
import { exactSectionArea } from '../geometry/section-outline';
import { migratePatternDocument, parsePatternDocument } from './parse-pattern';
import { FORMAT_VERSION } from './pattern-schema';

/** A format 1 document as version 1 of the program wrote it (no curved edges). */
const version1 = () => ({
  formatVersion: 1,
  title: 'Nine patch',
  canvas: { widthIn: 6, heightIn: 6 },
  sections: [{ id: 'a', label: 'A', geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 6, y: 0 }, { x: 6, y: 6 }, { x: 0, y: 6 }] } }],
});

/** A document with one straight section, to be changed and parsed. */
function issuesOf(geometry: unknown) {
  const result = parsePatternDocument({ formatVersion: 2, title: 'Curves', canvas: { widthIn: 10, heightIn: 10 }, sections: [{ id: 'a', label: 'A', geometry }] });
  return result.ok ? [] : result.issues;
}

describe('format version 2: curved edges in the document', () => {
  it('reads a format 1 document as version 2, every edge straight, leaving the input alone', () => {
    const raw = version1();
    const migrated = migratePatternDocument(raw);
    expect(migrated).toEqual({ ok: true, value: { ...raw, formatVersion: 2 } });
    expect(raw.formatVersion).toBe(1);
    const result = parsePatternDocument(raw);
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    expect(FORMAT_VERSION).toBe(2);
    expect(result.document.formatVersion).toBe(2);
    expect(result.document.sections[0].geometry).toEqual(version1().sections[0].geometry);
    expect(exactSectionArea(result.document.sections[0].geometry)).toBe(36);
  });

  it('keeps bulges exactly through JSON and back', () => {
    const doc = curvedCornerDocument();
    const text = JSON.stringify(doc);
    const again = parsePatternDocument(JSON.parse(text));
    if (!again.ok) throw new Error(JSON.stringify(again.issues));
    expect(again.document).toEqual(doc);
    const g = again.document.sections[1].geometry;
    expect(g.kind === 'straight' && g.bulges).toEqual([0, 0, 0, 0, -Math.tan(Math.PI / 8)]);
    expect(JSON.stringify(again.document)).toBe(text);
  });

  it('needs one bulge per vertex, each at most a half circle', () => {
    const square = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }];
    expect(issuesOf({ kind: 'straight', vertices: square, bulges: [0, 0, 0.5, 0] })).toEqual([]);
    expect(issuesOf({ kind: 'straight', vertices: square, bulges: [0, 0.5] })).toEqual([
      { path: 'sections.0.geometry.bulges', message: 'must have one bulge per vertex (edge i runs from vertex i to vertex i + 1)' },
    ]);
    expect(issuesOf({ kind: 'straight', vertices: square, bulges: [0, 0, 1.2, 0] })).toEqual([
      { path: 'sections.0.geometry.bulges.2', message: 'must be between -1 and 1 (a half circle)' },
    ]);
    expect(issuesOf({ kind: 'straight', vertices: square, bulges: [0, Number.NaN, 0, 0] })[0].path).toBe('sections.0.geometry.bulges.1');
  });

  it('rejects a curve that crosses the outline, naming the edges and the point', () => {
    // A 4 × 1 strip whose bottom edge curves up into a half circle of radius 2: it crosses the top edge.
    const strip = [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 1 }, { x: 0, y: 1 }];
    const issues = issuesOf({ kind: 'straight', vertices: strip, bulges: [0, 0, -1, 0] });
    // The circle about (2, 1) of radius 2 meets y = 0 at x = 2 ± √3: the first crossing is at 3.732.
    expect(issues).toEqual([
      { path: 'sections.0.geometry.vertices', message: 'outline crosses itself at (3.732, 0): edge 0 (0, 0)–(4, 0) meets curved edge 2 (4, 1)–(0, 1)' },
    ]);
    // Curving the other way (out of the strip) is a fine outline.
    expect(issuesOf({ kind: 'straight', vertices: strip, bulges: [0, 0, 1, 0] })).toEqual([]);
  });

  it('rejects a curve on an edge with no length, and one reaching past the size limit', () => {
    expect(issuesOf({ kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }], bulges: [0.3, 0, 0, 0] })).toEqual([
      { path: 'sections.0.geometry.bulges.0', message: 'edge 0 has no length (both ends at (0, 0)), so it cannot curve' },
    ]);
    // The bottom edge bulges out (down) into a half circle of radius 5 from y = 197: it reaches y = 202.
    const low = [{ x: 0, y: 192 }, { x: 10, y: 192 }, { x: 10, y: 197 }, { x: 0, y: 197 }];
    const issues = issuesOf({ kind: 'straight', vertices: low, bulges: [0, 0, 1, 0] });
    expect(issues).toHaveLength(1);
    expect(issues[0].path).toBe('sections.0.geometry.bulges.2');
    expect(issues[0].message).toMatch(/^curved edge 2 \(10, 197\)–\(0, 197\) reaches \([\d.]+, [\d.]+\), beyond the ±200 in\. limit$/);
    // Curving in instead, the half circle's top touches the top edge at (5, 192).
    expect(issuesOf({ kind: 'straight', vertices: low, bulges: [0, 0, -1, 0] })).toEqual([
      { path: 'sections.0.geometry.vertices', message: 'outline crosses itself at (5, 192): edge 0 (0, 192)–(10, 192) meets curved edge 2 (10, 197)–(0, 197)' },
    ]);
  });
});
