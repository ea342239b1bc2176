import { describe, expect, it } from 'vitest';
import type { BoardEditor } from '../editor/board-editor';
import { click, play, polar, testEditor, type PointerStep } from '../testing/board-fixtures';
import type { ArcSectionTool } from './arc-section.tool';

const C = { x: 12, y: 12 };

/** A 90° arc section 5–8 in. from the centre (12, 12). */
function withArc(): { ed: BoardEditor; id: string } {
  const ed = testEditor();
  ed.setTool('arc');
  const r = (ed.tool as ArcSectionTool).commitTyped({ centre: C, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 90 });
  if (!r.ok) throw new Error(r.message);
  return { ed, id: r.sectionId };
}

function radialSeam(deg: number): PointerStep[] {
  const a = polar(C, 5, deg);
  const m = polar(C, 6.5, deg);
  const b = polar(C, 8, deg);
  return [['down', a.x, a.y], ['move', m.x, m.y], ['move', b.x, b.y], ['up', b.x, b.y]];
}

/** Split into four patches by radial seams at 22.5°, 45° and 67.5°. */
function withFourPatches() {
  const { ed, id } = withArc();
  ed.setTool('split');
  for (const deg of [22.5, 45, 67.5]) play(ed, radialSeam(deg));
  return { ed, id, section: () => ed.store.document.sections[0] };
}

/** The derived patch that holds the point at radius 6.5 in., angle `deg`. */
function patchAtAngle(ed: BoardEditor, deg: number) {
  const s = ed.store.document.sections[0];
  return ed.analysis.patchAt(s, polar(C, 6.5, deg))!;
}

describe('Split tool', () => {
  it('draws a seam from edge to edge: the preview follows, the release splits the patch', () => {
    const { ed } = withArc();
    ed.setTool('split');
    const a = polar(C, 5.03, 45); // 0.03 in. off the inner arc: snaps onto it
    const b = polar(C, 8, 45);
    play(ed, [['down', a.x, a.y], ['move', b.x, b.y]]);
    expect(ed.tool.state).toBe('drawing');
    const preview = ed.tool.preview();
    expect(preview).toMatchObject({ kind: 'seam', valid: true });
    if (preview?.kind === 'seam') expect(Math.hypot(preview.a.x - C.x, preview.a.y - C.y)).toBeCloseTo(5, 2);
    play(ed, [['up', b.x, b.y]]);
    expect(ed.tool.state).toBe('idle');
    const s = ed.store.document.sections[0];
    expect(s.seams).toHaveLength(1);
    expect(ed.analysis.patches(s).map((p) => p.label).sort()).toEqual(['A1', 'A2']);
    // Each half of a 90° sector split at 45°: half the area, θ(R² − r²)/2 with θ = π/4 (CRC tables).
    const half = ((Math.PI / 4) * (64 - 25)) / 2;
    for (const p of ed.analysis.patches(s)) {
      let twice = 0;
      for (let i = 0; i < p.polygon.length; i++) twice += p.polygon[i].x * p.polygon[(i + 1) % p.polygon.length].y - p.polygon[(i + 1) % p.polygon.length].x * p.polygon[i].y;
      expect(Math.abs(twice) / 2).toBeCloseTo(half, 1);
    }
  });

  it('adds nothing for a seam drawn outside every section', () => {
    const { ed } = withArc();
    ed.setTool('split');
    play(ed, [['down', 1, 1], ['move', 3, 1], ['up', 3, 1]]);
    expect(ed.store.document.sections[0].seams).toHaveLength(0);
    expect(ed.store.undoDepth).toBe(1);
  });

  it('refuses a seam that stops inside the patch, and says why', () => {
    const { ed } = withArc();
    ed.setTool('split');
    ed.setSettings({ snapToPoints: false });
    const a = polar(C, 5, 45);
    const b = polar(C, 6.5, 45);
    play(ed, [['down', a.x, a.y], ['move', b.x, b.y], ['up', b.x, b.y]]);
    expect(ed.store.document.sections[0].seams).toHaveLength(0);
    expect(ed.store.undoDepth).toBe(1);
    expect(ed.tool.hint).toMatch(/splits no patch/);
  });

  it('splits an arc section into four patches numbered A1…A4, one undo step per seam', () => {
    const { ed, section } = withFourPatches();
    const patches = ed.analysis.patches(section());
    expect(patches.map((p) => p.label).sort()).toEqual(['A1', 'A2', 'A3', 'A4']);
    expect(section().patches).toHaveLength(4);
    expect(ed.store.undoDepth).toBe(4);
    ed.keyDown({ key: 'z', ctrlKey: true });
    expect(ed.analysis.patches(section())).toHaveLength(3);
    ed.keyDown({ key: 'z', ctrlKey: true, shiftKey: true });
    expect(ed.analysis.patches(section())).toHaveLength(4);
  });
});

describe('Renumber tool', () => {
  it('numbers patches in click order as one undo step', () => {
    const { ed, section } = withFourPatches();
    ed.setTool('renumber');
    const angles = [80, 10, 55, 30];
    for (const [k, deg] of angles.entries()) {
      const p = polar(C, 6.5, deg);
      play(ed, click(p.x, p.y));
      if (k < 3) expect(ed.tool.state).toBe('numbering');
    }
    expect(ed.tool.state).toBe('idle');
    expect(angles.map((deg) => patchAtAngle(ed, deg).label)).toEqual(['A1', 'A2', 'A3', 'A4']);
    ed.undo();
    expect(section().seams).toHaveLength(3);
    expect(ed.store.undoDepth).toBe(4);
  });

  it('keeps the clicked numbers when finished early with Enter, and restores them with Escape', () => {
    const { ed } = withFourPatches();
    const before = [10, 30, 55, 80].map((d) => patchAtAngle(ed, d).number);
    ed.setTool('renumber');
    const p = polar(C, 6.5, 80);
    play(ed, click(p.x, p.y));
    ed.keyDown({ key: 'Escape' });
    expect([10, 30, 55, 80].map((d) => patchAtAngle(ed, d).number)).toEqual(before);
    play(ed, click(p.x, p.y));
    ed.keyDown({ key: 'Enter' });
    expect(patchAtAngle(ed, 80).number).toBe(1);
    expect(new Set([10, 30, 55, 80].map((d) => patchAtAngle(ed, d).number))).toEqual(new Set([1, 2, 3, 4]));
  });
});

describe('Fabric fill and strip set tools', () => {
  it('fills the clicked patch with the chosen fabric and clears it with Alt-click', () => {
    const { ed } = withFourPatches();
    ed.setTool('fill');
    ed.setSettings({ activeFabricId: 'sage' });
    const p = polar(C, 6.5, 30);
    play(ed, click(p.x, p.y));
    expect(patchAtAngle(ed, 30).fabricId).toBe('sage');
    expect(patchAtAngle(ed, 10).fabricId).toBeUndefined();
    play(ed, click(p.x, p.y, { altKey: true }));
    expect(patchAtAngle(ed, 30).fabricId).toBeUndefined();
  });

  it('keeps fills and numbers with their patches when another seam splits a neighbour', () => {
    const { ed } = withArc();
    ed.setTool('split');
    play(ed, radialSeam(45));
    ed.setTool('fill');
    ed.setSettings({ activeFabricId: 'plum' });
    const p = polar(C, 6.5, 70);
    play(ed, click(p.x, p.y));
    const numberBefore = patchAtAngle(ed, 70).number;
    ed.setTool('split');
    play(ed, radialSeam(22.5));
    expect(patchAtAngle(ed, 70)).toMatchObject({ fabricId: 'plum', number: numberBefore });
    expect(ed.analysis.patches(ed.store.document.sections[0])).toHaveLength(3);
  });

  it('lays a strip set of the chosen widths on a patch, starting with the chosen fabric', () => {
    const { ed } = withFourPatches();
    ed.setTool('strip-set');
    ed.setSettings({ activeFabricId: 'plum', stripWidthsIn: [2, 1, 2] });
    const p = polar(C, 6.5, 55);
    play(ed, click(p.x, p.y));
    const strips = patchAtAngle(ed, 55).stripSet?.strips;
    expect(strips).toEqual([
      { fabricId: 'plum', finishedWidthIn: 2 },
      { fabricId: 'oat', finishedWidthIn: 1 },
      { fabricId: 'sage', finishedWidthIn: 2 },
    ]);
    // Two strip seams, each drawn as a guide line across the patch (laid out by the piecing library).
    expect(patchAtAngle(ed, 55).guideLines).toHaveLength(2);
    expect(patchAtAngle(ed, 55).stripBands?.map((b) => b.fabricId)).toEqual(['plum', 'oat', 'sage']);
    play(ed, click(p.x, p.y, { altKey: true }));
    expect(patchAtAngle(ed, 55).stripSet).toBeUndefined();
  });
});

describe('Ring repeat and delete tools', () => {
  it('repeats a section around the centre it snaps to', () => {
    const { ed } = withArc();
    ed.setTool('ring');
    ed.setSettings({ ringCount: 4 });
    const inside = polar(C, 6.5, 45);
    play(ed, click(inside.x, inside.y));
    expect(ed.tool.state).toBe('choosing-centre');
    play(ed, click(12.03, 11.98)); // within the catch radius of the arc's centre
    expect(ed.store.document.sections[0].ringRepeat).toEqual({ count: 4, centre: { x: 12, y: 12 } });
    expect(ed.tool.state).toBe('idle');
  });

  it('lets a click on a ring-repeat copy select the section and fill the patch it repeats', () => {
    const { ed } = withArc();
    ed.setTool('split');
    play(ed, radialSeam(45));
    ed.setTool('ring');
    ed.setSettings({ ringCount: 4 });
    const inside = polar(C, 6.5, 45);
    play(ed, [...click(inside.x, inside.y), ...click(12, 12)]);
    // The copy turned by 90° covers 90°…180°; its half at 160° repeats the section's half at 70°.
    ed.setTool('fill');
    ed.setSettings({ activeFabricId: 'oat' });
    const onCopy = polar(C, 6.5, 160);
    play(ed, click(onCopy.x, onCopy.y));
    expect(patchAtAngle(ed, 70).fabricId).toBe('oat');
    expect(patchAtAngle(ed, 20).fabricId).toBeUndefined();
    ed.setTool('select');
    ed.store.select({ sectionId: null, patchIndex: null });
    play(ed, click(onCopy.x, onCopy.y));
    expect(ed.store.selection.sectionId).toBe(ed.store.document.sections[0].id);
    // Split and delete act on the section as drawn only.
    ed.setTool('delete');
    play(ed, click(onCopy.x, onCopy.y));
    expect(ed.store.document.sections).toHaveLength(1);
  });

  it('deletes a seam when clicked on it, else the section', () => {
    const { ed, section } = withFourPatches();
    ed.setTool('delete');
    const onSeam = polar(C, 6.5, 45);
    play(ed, click(onSeam.x, onSeam.y));
    expect(section().seams).toHaveLength(2);
    expect(ed.analysis.patches(section())).toHaveLength(3);
    const inPatch = polar(C, 6.5, 33);
    play(ed, click(inPatch.x, inPatch.y));
    expect(ed.store.document.sections).toHaveLength(0);
    ed.undo();
    ed.undo();
    expect(section().seams).toHaveLength(3);
  });
});
