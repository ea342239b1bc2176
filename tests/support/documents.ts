/**
 * Valid pattern documents for the fault tests, written by hand (invented data): a 6 in. block of
 * straight sections in a grid plus a ring of arc sections, with a title that carries a marker so a
 * stored revision can be matched to the save that wrote it.
 */
import type { PatternDocumentInput } from '@seamwright/piecing';

/**
 * A block of `cols × rows` straight 2 in. square sections, each split by one diagonal-free vertical
 * seam into two patches, plus `arcs` arc sections of a ring (5–6 in.) around the block's centre.
 */
export function gridDocument(title: string, cols = 3, rows = 3, arcs = 4): PatternDocumentInput {
  const sections: NonNullable<PatternDocumentInput['sections']> = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const i = r * cols + c;
      const x = c * 2;
      const y = r * 2;
      sections.push({
        id: `s${i}`,
        label: sectionLabel(i),
        geometry: {
          kind: 'straight',
          vertices: [
            { x, y },
            { x: x + 2, y },
            { x: x + 2, y: y + 2 },
            { x, y: y + 2 },
          ],
        },
        seams: [{ id: `m${i}`, a: { x: x + 1, y }, b: { x: x + 1, y: y + 2 } }],
        patches: [
          { number: 1, anchor: { x: x + 0.5, y: y + 1 }, fabricId: 'ink' },
          { number: 2, anchor: { x: x + 1.5, y: y + 1 }, fabricId: 'oat' },
        ],
      });
    }
  }
  const centre = { x: cols, y: rows };
  for (let k = 0; k < arcs; k++) {
    const i = cols * rows + k;
    sections.push({
      id: `a${k}`,
      label: sectionLabel(i),
      geometry: {
        kind: 'arc',
        centre,
        innerRadiusIn: 5,
        outerRadiusIn: 6,
        startAngleDeg: (360 / arcs) * k,
        sweepDeg: 360 / arcs,
      },
      patches: [{ number: 1, anchor: { x: centre.x + 5.5 * Math.cos(((360 / arcs) * (k + 0.5) * Math.PI) / 180), y: centre.y + 5.5 * Math.sin(((360 / arcs) * (k + 0.5) * Math.PI) / 180) }, fabricId: 'sage' }],
    });
  }
  return {
    formatVersion: 1,
    title,
    canvas: { widthIn: Math.max(cols * 2, 12 + cols), heightIn: Math.max(rows * 2, 12 + rows) },
    fabrics: [
      { id: 'ink', name: 'Ink', colour: '#20243a' },
      { id: 'oat', name: 'Oat', colour: '#e6dcc4' },
      { id: 'sage', name: 'Sage', colour: '#8da487' },
    ],
    sections,
  };
}

/** The smallest valid document: one 3 in. square section. */
export function tinyDocument(title = 'Tiny square'): PatternDocumentInput {
  return {
    formatVersion: 1,
    title,
    canvas: { widthIn: 3, heightIn: 3 },
    sections: [
      {
        id: 'a',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 3 }, { x: 0, y: 3 }] },
      },
    ],
  };
}

/** Section letters as quilters write them: A … Z, AA, AB … */
export function sectionLabel(i: number): string {
  let s = '';
  let n = i;
  do {
    s = String.fromCharCode(65 + (n % 26)) + s;
    n = Math.floor(n / 26) - 1;
  } while (n >= 0);
  return s;
}

/**
 * A document whose print set has about two template sheets per section on Letter paper: `count`
 * straight sections of 6.5 × 9 in. (with ¼ in. seam allowance they do not fit one 7.5 × 10 in.
 * printable area with the sheet frame, so each is tiled over two sheets), each split by one seam.
 */
export function manySheetsDocument(count: number, title = 'Many sheets'): PatternDocumentInput {
  const sections = Array.from({ length: count }, (_, i) => {
    const x = (i % 10) * 8;
    const y = Math.floor(i / 10) * 10;
    return {
      id: `s${i}`,
      label: sectionLabel(i),
      geometry: { kind: 'straight' as const, vertices: [{ x, y }, { x: x + 6.5, y }, { x: x + 6.5, y: y + 9 }, { x, y: y + 9 }] },
      seams: [{ id: 'm', a: { x: x + 3, y }, b: { x: x + 3.5, y: y + 9 } }],
      patches: [
        { number: 1, anchor: { x: x + 1, y: y + 4 } },
        { number: 2, anchor: { x: x + 5, y: y + 4 } },
      ],
    };
  });
  return { formatVersion: 1, title, canvas: { widthIn: 80, heightIn: Math.ceil(count / 10) * 10 }, sections };
}
