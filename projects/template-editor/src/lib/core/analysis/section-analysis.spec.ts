import { describe, expect, it } from 'vitest';
import type { Section } from '@seamwright/piecing';
import { addSection, findSection, setPatchFabric } from '../commands/section-commands';
import { emptyPattern } from '../testing/board-fixtures';
import type { GeometryPort } from './geometry-port';
import { piecingGeometry } from './piecing-geometry';
import { SectionAnalysis } from './section-analysis';

/** The piecing port, counting how often it derives the patches of each section object. */
function countingPort(): { port: GeometryPort; calls: Map<Section, number> } {
  const real = piecingGeometry();
  const calls = new Map<Section, number>();
  const port: GeometryPort = {
    ...real,
    patches(section) {
      calls.set(section, (calls.get(section) ?? 0) + 1);
      return real.patches(section);
    },
  };
  return { port, calls };
}

describe('section analysis', () => {
  it('lets a command reuse the patches the board derived for the same section object', () => {
    const { port, calls } = countingPort();
    const analysis = new SectionAnalysis(port);
    const added = addSection(emptyPattern(), { kind: 'wedge', centre: { x: 12, y: 12 }, radiusIn: 4, startAngleDeg: 0, sweepDeg: 45 }, analysis.geometry);
    const section = findSection(added.document, added.sectionId)!;
    // A wedge without seams is one patch.
    expect(analysis.patches(section)).toHaveLength(1);
    const filled = setPatchFabric(added.document, added.sectionId, 0, 'plum', analysis.geometry);
    expect(findSection(filled, added.sectionId)!.patches[0].fabricId).toBe('plum');
    expect(analysis.sewability(section)).toEqual({ ok: true });
    expect(calls.get(section)).toBe(1);
  });

  it('gives commands the port’s error again for a section it cannot derive, and the board no patches', () => {
    let derivations = 0;
    const port: GeometryPort = {
      ...piecingGeometry(),
      patches() {
        derivations++;
        throw new Error('outline crosses itself');
      },
    };
    const analysis = new SectionAnalysis(port);
    const section = { id: 's1', label: 'A', geometry: { kind: 'straight', vertices: [] }, seams: [], patches: [] } as unknown as Section;
    expect(() => analysis.geometry.patches(section)).toThrow('outline crosses itself');
    expect(() => analysis.geometry.patches(section)).toThrow('outline crosses itself');
    expect(analysis.patches(section)).toEqual([]);
    expect(derivations).toBe(1);
  });
});
