import { describe, expect, it } from 'vitest';
import { buildGardenGate } from '../demo/index';
import { seamPressing } from './index';

describe('seamPressing', () => {
  it('presses each seam toward the patch just added by default (usual practice on a foundation: common practice)', () => {
    // Garden Gate A: the brick goose (A1), then the sky either side, A2 along seam a-left and A3 along a-right.
    expect(seamPressing(buildGardenGate(), 'roof')).toEqual([
      { seamId: 'a-left', press: 'added', addedPatch: 2, previousPatch: 1, towardPatch: 2 },
      { seamId: 'a-right', press: 'added', addedPatch: 3, previousPatch: 1, towardPatch: 3 },
    ]);
  });

  it("follows the designer's choice per seam: toward the earlier patches, or open", () => {
    const doc = buildGardenGate();
    doc.sections[0].seams[0].press = 'previous';
    doc.sections[0].seams[1].press = 'open';
    expect(seamPressing(doc, 'roof')).toEqual([
      { seamId: 'a-left', press: 'previous', addedPatch: 2, previousPatch: 1, towardPatch: 1 },
      { seamId: 'a-right', press: 'open', addedPatch: 3, previousPatch: 1 },
    ]);
  });

  it('follows the piecing order: renumbered patches change which patch each seam sews on', () => {
    const doc = buildGardenGate();
    // B: the moss gate bar in the middle as 1; swap the numbers of the two cream sides.
    const gate = doc.sections[1];
    gate.patches = gate.patches.map((p) => (p.number === 2 ? { ...p, number: 3 } : p.number === 3 ? { ...p, number: 2 } : p));
    expect(seamPressing(doc, 'gate').map((s) => [s.seamId, s.addedPatch, s.towardPatch])).toEqual([
      ['b-left', 3, 3],
      ['b-right', 2, 2],
    ]);
  });

  it('answers nothing for a section that is not there', () => {
    expect(seamPressing(buildGardenGate(), 'chimney')).toEqual([]);
  });
});
