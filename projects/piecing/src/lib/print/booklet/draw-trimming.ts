import type { Point, Section } from '../../document/index';
import { sectionSeamAllowance } from '../../fabrication/index';
import type { BookletContext } from './booklet-context';
import type { BookletWriter } from './booklet-writer';
import { DIAGRAM_STYLES, fitDiagram } from './diagram';

/** What the trimming part says about cutting edges (common practice). */
export const TRIMMING_RULE =
  'Trim straight edges with a rotary cutter and a ruler laid on the cutting line; cut curved edges with scissors, following the line.';

/** Which edges of a section are curved, in words, or null when all are straight. */
export function curvedEdges(section: Section): string | null {
  const g = section.geometry;
  if (g.kind === 'arc') return 'the inner and outer edges are curved';
  if (g.kind === 'wedge') return 'the outer edge is curved';
  const curved = (g.bulges ?? []).some((b) => Math.abs(b) > 1e-9) || followsCurve(g.vertices);
  return curved ? 'one or more edges follow a curve' : null;
}

/** Whether a straight outline has a run of short, gently turning edges: a curve written as chords. */
function followsCurve(vertices: readonly Point[]): boolean {
  let run = 0;
  for (let i = 0; i < vertices.length; i++) {
    const a = vertices[(i + vertices.length - 1) % vertices.length];
    const b = vertices[i];
    const c = vertices[(i + 1) % vertices.length];
    const turn = Math.abs(Math.atan2((b.x - a.x) * (c.y - b.y) - (b.y - a.y) * (c.x - b.x), (b.x - a.x) * (c.x - b.x) + (b.y - a.y) * (c.y - b.y)));
    run = turn > 1e-3 && turn < 0.2 ? run + 1 : 0;
    if (run >= 3) return true;
  }
  return false;
}

/**
 * Trimming: each section cut on its cutting line, the allowance kept; straight edges with a ruler,
 * curves with scissors. A small diagram of each section shows sewing line and cutting line.
 */
export function drawTrimming(ctx: BookletContext, writer: BookletWriter): void {
  const flow = writer.part('Trimming');
  flow.heading('Trimming the sections');
  flow.paragraph(
    `When the last patch of a section is on and pressed, trim the section on its cutting line (dashed), keeping the ${ctx.document.seamAllowanceIn === 0.25 ? '¼' : ctx.document.seamAllowanceIn} in. seam allowance beyond the outer sewing line. ${TRIMMING_RULE} ` +
      'Leave the paper on until the section is joined: it keeps bias edges from stretching.',
    9,
  );
  const cols = 4;
  const cellW = flow.width / cols;
  const sections = ctx.document.sections;
  const lineIn = 0.135;
  const captions = sections.map((section) => {
    const curved = curvedEdges(section);
    return ctx.pen.wrap(`${section.label}: ${curved ? `${curved} — scissors there, ruler on the straight edges` : 'all edges straight — ruler and rotary cutter'}`, cellW - 0.15, 7.5);
  });
  for (let row = 0; row * cols < sections.length; row++) {
    const items = sections.slice(row * cols, row * cols + cols);
    // The row is as tall as its longest caption: every caption is printed whole.
    const lines = Math.max(3, ...items.map((_, c) => captions[row * cols + c].length));
    const top = flow.block(1.55 + 0.1 + lines * lineIn);
    items.forEach((section, c) => {
      const { sewingLine, cuttingLine } = sectionSeamAllowance(section, ctx.document.seamAllowanceIn);
      const box = { x: top.x + c * cellW + 0.05, y: top.y, width: cellW - 0.1, height: 1.45 };
      const fit = fitDiagram(cuttingLine, box, false);
      ctx.pen.polyline(cuttingLine.map(fit.map), true, { widthPt: 0.7, dashPt: [3, 2], colour: '#000000' });
      ctx.pen.polyline(sewingLine.map(fit.map), true, DIAGRAM_STYLES.outline);
      captions[row * cols + c].forEach((l, k) => ctx.pen.text(l, { x: box.x, y: top.y + 1.6 + k * lineIn }, { sizePt: 7.5 }));
    });
  }
}
