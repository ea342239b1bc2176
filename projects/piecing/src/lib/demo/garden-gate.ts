import type { PatternDocument, Point, Section } from '../document/pattern-schema';
import { seam } from './demo-helpers';

const rect = (x0: number, y0: number, x1: number, y1: number): Point[] => [
  { x: x0, y: y0 },
  { x: x1, y: y0 },
  { x: x1, y: y1 },
  { x: x0, y: y1 },
];

/**
 * "Garden Gate", the demo block (invented, docs/design-notes.md#demo-data): an 8 in. straight-seam block in three
 * sections — A, a roof (a goose triangle with sky either side); B, the gate with its centre bar; C, a
 * path widening towards the viewer between two beds. Each section is sewn 1, 2, 3.
 */
export function buildGardenGate(): PatternDocument {
  const sections: Section[] = [
    {
      id: 'roof',
      label: 'A',
      geometry: { kind: 'straight', vertices: rect(0, 0, 8, 3) },
      seams: [seam('a-left', { x: 4, y: 0 }, { x: 0, y: 3 }), seam('a-right', { x: 4, y: 0 }, { x: 8, y: 3 })],
      patches: [
        { number: 1, anchor: { x: 4, y: 2 }, fabricId: 'brick' },
        { number: 2, anchor: { x: 1, y: 0.75 }, fabricId: 'cream' },
        { number: 3, anchor: { x: 7, y: 0.75 }, fabricId: 'cream' },
      ],
    },
    {
      id: 'gate',
      label: 'B',
      geometry: { kind: 'straight', vertices: rect(0, 3, 8, 5.5) },
      seams: [seam('b-left', { x: 2.75, y: 3 }, { x: 2.75, y: 5.5 }), seam('b-right', { x: 5.25, y: 3 }, { x: 5.25, y: 5.5 })],
      patches: [
        { number: 1, anchor: { x: 4, y: 4.25 }, fabricId: 'moss' },
        { number: 2, anchor: { x: 1.25, y: 4.25 }, fabricId: 'cream' },
        { number: 3, anchor: { x: 6.75, y: 4.25 }, fabricId: 'cream' },
      ],
    },
    {
      id: 'path',
      label: 'C',
      geometry: { kind: 'straight', vertices: rect(0, 5.5, 8, 8) },
      seams: [seam('c-left', { x: 3.25, y: 5.5 }, { x: 2.25, y: 8 }), seam('c-right', { x: 4.75, y: 5.5 }, { x: 5.75, y: 8 })],
      patches: [
        { number: 1, anchor: { x: 4, y: 6.75 }, fabricId: 'cream' },
        { number: 2, anchor: { x: 1, y: 6.75 }, fabricId: 'moss' },
        { number: 3, anchor: { x: 7, y: 6.75 }, fabricId: 'moss' },
      ],
      note: 'Press the beds away from the path.',
    },
  ];
  return {
    formatVersion: 2,
    title: 'Garden Gate',
    displayUnit: 'in',
    seamAllowanceIn: 0.25,
    piecingMarginIn: 0.5,
    blockCount: 4,
    pressingsPerTemplate: 16,
    canvas: { widthIn: 8, heightIn: 8 },
    fabrics: [
      { id: 'cream', name: 'Cream', colour: '#f1e8d2', usableWofIn: 42 },
      { id: 'moss', name: 'Moss', colour: '#5f7f4a', usableWofIn: 42 },
      { id: 'brick', name: 'Brick', colour: '#a4493d', usableWofIn: 40 },
    ],
    sections,
  };
}
