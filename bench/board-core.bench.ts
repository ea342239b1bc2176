/**
 * The Drafting board's editor core on the 1,000-patch stress pattern, without drawing: (1) deriving
 * every section's patches through a fresh SectionAnalysis (split, label points, numbering); (2) a
 * vertex drag on one 10-patch section, each frame being the pointer move (snap, command, re-derive)
 * plus what a frame then reads of every section (patches, sewability, problems). The analysis counts
 * the splits it makes: one per frame means the dragged section is split once, however often it is read.
 */
import { buildStressPattern } from '@seamwright/piecing/testing';
import { BoardEditor, SectionAnalysis } from '@seamwright/template-editor-core';
import { ms, summarise, timeRuns, type BenchSection } from './bench-kit';

export default async function boardCore(): Promise<BenchSection> {
  const doc = buildStressPattern(1000);
  const derive = await timeRuns(() => {
    const analysis = new SectionAnalysis();
    for (const s of doc.sections) analysis.patches(s);
  }, 9, 2);

  const ed = new BoardEditor(doc);
  ed.setSize(2400, 2400);
  ed.setViewport({ scale: 100, originX: 0, originY: 0, mirrored: false, mirrorWidthIn: doc.canvas.widthIn });
  ed.setSettings({ grid: 'off', snapToPoints: false });
  for (const s of doc.sections) ed.analysis.patches(s);
  const target = doc.sections[50];
  if (target.geometry.kind !== 'straight') throw new Error('the stress pattern is made of straight sections');
  const v = target.geometry.vertices[2];
  const screen = (p: { x: number; y: number }) => ({ x: p.x * 100, y: p.y * 100 });
  const inside = screen({ x: v.x - 0.2, y: v.y - 0.2 });
  ed.pointerDown(inside, { button: 0 });
  ed.pointerUp(inside, { button: 0 });
  const frames: number[] = [];
  const splitsBefore = ed.analysis.splitsMade;
  for (let round = 0; round < 4; round++) {
    ed.pointerDown(screen(v), { button: 0 });
    for (let i = 1; i <= 60; i++) {
      const t = performance.now();
      const a = (i / 60) * Math.PI * 2;
      ed.pointerMove(screen({ x: v.x + 0.3 * Math.cos(a), y: v.y + 0.2 * Math.sin(a) }), {});
      for (const s of ed.store.document.sections) {
        ed.analysis.patches(s);
        ed.analysis.sewability(s);
        ed.analysis.problems(s);
      }
      frames.push(performance.now() - t);
    }
    ed.pointerUp(screen(v), { button: 0 });
  }
  const f = summarise(frames);
  const splitsPerFrame = (ed.analysis.splitsMade - splitsBefore) / frames.length;
  return {
    title: 'Drafting board core: 1,000-patch stress pattern, no drawing',
    rows: [
      { measure: 'derive every section (split, label points, numbering)', runs: derive.runs, medianMs: ms(derive.medianMs), p95Ms: ms(derive.p95Ms) },
      { measure: 'drag frame: pointer move + frame reads', runs: f.runs, medianMs: ms(f.medianMs), p95Ms: ms(f.p95Ms) },
    ],
    notes: [`${doc.sections.length} sections; splits per drag frame: ${splitsPerFrame.toFixed(2)} (the dragged section once).`],
  };
}
