import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { EXAMPLE_NAMES, EXAMPLES_DIR, exampleJson, type ExampleName } from '../../../../../tests/fixtures/documents';
import { sectionEdges } from '../geometry/curved-edge';
import { expandRingRepeat } from '../geometry/ring-repeat';
import { distance } from '../geometry/vector';
import { patternJsonSchema, patternJsonSchemaText } from './json-schema';
import { parsePatternDocument } from './parse-pattern';

const docs = fileURLToPath(new URL('../../../../../docs/', import.meta.url));

describe('JSON Schema', () => {
  it('the committed docs/pattern-format.schema.json is current (rewrite it with `npm run seamwright -- schema --write`)', () => {
    expect(readFileSync(`${docs}pattern-format.schema.json`, 'utf8')).toBe(patternJsonSchemaText());
  });

  it('carries the bounds of the fields', () => {
    const schema = patternJsonSchema() as any;
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.required).toEqual(['formatVersion', 'title', 'canvas']);
    const kinds = schema.properties.sections.items.properties.geometry.oneOf ?? schema.properties.sections.items.properties.geometry.anyOf;
    const arc = kinds.find((k: any) => k.properties.kind.const === 'arc');
    expect(arc.properties.outerRadiusIn).toMatchObject({ type: 'number', exclusiveMinimum: 0, maximum: 200 });
    expect(arc.properties.sweepDeg).toMatchObject({ minimum: 0.01, maximum: 360 });
  });
});

describe('example files in docs/examples', () => {
  const files = readdirSync(EXAMPLES_DIR).filter((f) => f.endsWith('.json'));

  it('are all valid pattern documents, and the fixtures list them all', () => {
    expect(files.sort()).toEqual(EXAMPLE_NAMES.map((n) => `${n}.json`));
    for (const name of EXAMPLE_NAMES) {
      const result = parsePatternDocument(exampleJson(name));
      expect(result.ok ? [] : result.issues, name).toEqual([]);
    }
  });

  it('hold what their names promise', () => {
    const read = (name: ExampleName) => {
      const r = parsePatternDocument(exampleJson(name));
      if (!r.ok) throw new Error(name);
      return r.document;
    };
    expect(read('straight-block-three-sections').sections.map((s) => s.geometry.kind)).toEqual(['straight', 'straight', 'straight']);
    const ring = read('arc-ring-with-strip-set');
    const band = ring.sections.find((s) => s.geometry.kind === 'arc')!;
    expect(expandRingRepeat(band)).toHaveLength(8);
    expect(band.patches.some((p) => p.stripSet && p.stripSet.strips.length === 3)).toBe(true);
    // The corner's curved edge lies on the quarter circle's arc: both ends on it, its centre at the circle's.
    const [quarter, corner] = read('corner-following-a-ring').sections;
    if (quarter.geometry.kind !== 'wedge' || corner.geometry.kind !== 'straight') throw new Error('kinds');
    const curved = sectionEdges(corner.geometry).filter((e) => e.arc);
    expect(curved.map((e) => e.index)).toEqual([4]);
    expect(distance(curved[0].arc!.centre, quarter.geometry.centre)).toBeLessThan(1e-12);
    expect(curved[0].arc!.radiusIn).toBeCloseTo(quarter.geometry.radiusIn, 12);
  });
});
