import type { PatternDocumentInput } from '@seamwright/piecing';

/** A document a new pattern can start from. */
export interface Starter {
  id: string;
  name: string;
  description: string;
  build: (title: string) => PatternDocumentInput;
}

const fabrics = [
  { id: 'plum', name: 'Plum', colour: '#6b2f62', usableWofIn: 42 },
  { id: 'oat', name: 'Oat', colour: '#e8dcc2', usableWofIn: 42 },
  { id: 'sage', name: 'Sage', colour: '#8da38a', usableWofIn: 42 },
];

/** Starters offered by "New pattern": a blank block and two small invented layouts. */
export const STARTERS: readonly Starter[] = [
  {
    id: 'blank',
    name: 'Blank block',
    description: 'An empty 24 in. square to draft on, with three fabrics to fill patches with.',
    build: (title) => ({ formatVersion: 1, title, canvas: { widthIn: 24, heightIn: 24 }, fabrics, sections: [] }),
  },
  {
    id: 'two-strip-block',
    name: 'Two straight sections',
    description: 'An 8 in. block cut into two straight sections, A and B, ready to split.',
    build: (title) => ({
      formatVersion: 1,
      title,
      canvas: { widthIn: 8, heightIn: 8 },
      fabrics,
      sections: [
        {
          id: 'sec-a',
          label: 'A',
          geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 8, y: 0 }, { x: 8, y: 4 }, { x: 0, y: 4 }] },
          patches: [{ number: 1, anchor: { x: 4, y: 2 }, fabricId: 'oat' }],
        },
        {
          id: 'sec-b',
          label: 'B',
          geometry: { kind: 'straight', vertices: [{ x: 0, y: 4 }, { x: 8, y: 4 }, { x: 8, y: 8 }, { x: 0, y: 8 }] },
          patches: [{ number: 1, anchor: { x: 4, y: 6 }, fabricId: 'sage' }],
        },
      ],
    }),
  },
  {
    id: 'arc-ring',
    name: 'Ring of eight arcs',
    description: 'A 16 in. square with one arc section (5–8 in.) repeated eight times around the centre.',
    build: (title) => ({
      formatVersion: 1,
      title,
      canvas: { widthIn: 16, heightIn: 16 },
      fabrics,
      sections: [
        {
          id: 'sec-a',
          label: 'A',
          geometry: { kind: 'arc', centre: { x: 8, y: 8 }, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 45 },
          ringRepeat: { count: 8, centre: { x: 8, y: 8 } },
          // Anchor inside the arc: radius 6.5 in. at 22.5°, from the centre (8, 8).
          patches: [{ number: 1, anchor: { x: 14.005, y: 10.487 }, fabricId: 'plum' }],
        },
      ],
    }),
  },
];
