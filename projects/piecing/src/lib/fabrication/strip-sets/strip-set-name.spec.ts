import { describe, expect, it } from 'vitest';
import { readPatternDocument } from '../../document/parse-pattern';
import { buildCuttingList } from '../cutting-list/build-cutting-list';
import { sectionStripSets } from './section-guide-lines';
import { stripSetDisplayName } from './strip-set-name';

describe('stripSetDisplayName', () => {
  it('uses the name the designer gave, trimmed', () => {
    expect(stripSetDisplayName('  Sunset stripes ', ['A3'])).toBe('Sunset stripes');
  });

  it('names an unnamed set after the patches it fills, each once, never by its id', () => {
    expect(stripSetDisplayName(undefined, ['A3'])).toBe('Strip set for A3');
    expect(stripSetDisplayName('   ', ['A3', 'A3', 'B2'])).toBe('Strip set for A3, B2');
    expect(stripSetDisplayName(null, ['A1', 'A2', 'A3', 'B1', 'B2'])).toBe('Strip set for A1, A2, A3 and 2 more');
    expect(stripSetDisplayName(null, [])).toBe('Strip set');
  });
});

describe('strip sets in the cutting list and guide-line problems', () => {
  const doc = (name?: string) =>
    readPatternDocument({
      formatVersion: 1,
      title: 'T',
      canvas: { widthIn: 4, heightIn: 4 },
      fabrics: [
        { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
        { id: 'oat', name: 'Oat', colour: '#e8dcc0' },
      ],
      sections: [
        {
          id: 's',
          label: 'A',
          geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 4 }, { x: 0, y: 4 }] },
          // Two 1 in. strips cannot cover a 4 in. square across: a problem is reported.
          patches: [{ number: 1, anchor: { x: 2, y: 2 }, stripSet: { id: 'internal-7f3k', ...(name ? { name } : {}), strips: [{ fabricId: 'plum', finishedWidthIn: 1 }, { fabricId: 'oat', finishedWidthIn: 1 }] } }],
        },
      ],
    });

  it('speaks of the set by its name or the patch it fills, not its id', () => {
    for (const [name, expected] of [[undefined, 'Strip set for A1'], ['Sunset', 'Sunset']] as const) {
      const d = doc(name);
      const problems = [...buildCuttingList(d).problems.map((p) => p.message), ...sectionStripSets(d.sections[0]).flatMap((s) => s.problems)];
      expect(problems.length).toBeGreaterThan(0);
      expect(problems.some((m) => m.startsWith(`${expected} `) && m.includes('patch A1'))).toBe(true);
      for (const m of problems) expect(m).not.toContain('internal-7f3k');
    }
  });
});
