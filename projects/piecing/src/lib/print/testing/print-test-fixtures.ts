import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { readPatternDocument, type PatternDocument, type Point } from '../../document/index';
import { degToRad, pointOnCircle, polygonArea } from '../../geometry/index';
import type { PrintFonts } from '../print-options';
import type { PrintTemplate } from '../template-model';
import { misnumberedStrip } from '../../../../../../tests/fixtures/documents';

/*
 * Test-only helpers (never exported from the library): the shipped fonts read from disk, and small
 * invented documents with one section of each kind.
 */

/** The shipped fonts from the repository's fonts/ folder. */
export function readShippedFonts(): PrintFonts {
  const dir = new URL('../../../../../../fonts/', import.meta.url);
  return {
    regular: new Uint8Array(readFileSync(fileURLToPath(new URL('Roboto-Regular.ttf', dir)))),
    bold: new Uint8Array(readFileSync(fileURLToPath(new URL('Roboto-Bold.ttf', dir)))),
  };
}

/** An asymmetric straight section: a right-angled trapezoid, 3 in. wide, with two seams. */
export function asymmetricBlock(): PatternDocument {
  return readPatternDocument({
    formatVersion: 1,
    title: 'Test block',
    canvas: { widthIn: 4, heightIn: 3 },
    fabrics: [
      { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
      { id: 'oat', name: 'Oat', colour: '#e8dcc0' },
    ],
    sections: [
      {
        id: 'a',
        label: 'A',
        geometry: { kind: 'straight', vertices: [{ x: 0, y: 0 }, { x: 3, y: 0 }, { x: 3, y: 1 }, { x: 0, y: 2 }] },
        seams: [{ id: 's1', a: { x: 1, y: -1 }, b: { x: 1, y: 3 } }],
        patches: [
          { number: 1, anchor: { x: 0.5, y: 0.5 }, fabricId: 'plum' },
          { number: 2, anchor: { x: 2, y: 0.5 }, fabricId: 'oat' },
        ],
      },
    ],
  });
}

/** Points of a quarter circle from angle a0 to a1 (degrees) at radius r about c. */
function arcPoints(c: Point, r: number, a0: number, a1: number, n: number): Point[] {
  return Array.from({ length: n + 1 }, (_, i) => pointOnCircle(c, r, degToRad(a0 + ((a1 - a0) * i) / n)));
}

/**
 * A small medallion: wedge star, a ring of arcs with a strip set, and one large corner that must be
 * tiled. Invented for tests.
 */
export function testMedallion(): PatternDocument {
  const c = { x: 13, y: 13 };
  const corner = [{ x: 0, y: 0 }, { x: 13, y: 0 }, ...arcPoints(c, 11, 270, 180, 24).slice(1, -1), { x: 0, y: 13 }];
  corner.splice(2, 0, { x: 13, y: 2 });
  corner.splice(corner.length - 1, 0, { x: 2, y: 13 });
  return readPatternDocument({
    formatVersion: 1,
    title: 'Test medallion',
    canvas: { widthIn: 26, heightIn: 26 },
    fabrics: [
      { id: 'plum', name: 'Plum', colour: '#6b2d5c' },
      { id: 'oat', name: 'Oat', colour: '#e8dcc0' },
      { id: 'sage', name: 'Sage', colour: '#8fa382' },
      { id: 'ink', name: 'Ink', colour: '#1f2433' },
    ],
    sections: [
      {
        id: 'star',
        label: 'A',
        geometry: { kind: 'wedge', centre: c, radiusIn: 5, startAngleDeg: 0, sweepDeg: 45 },
        seams: [{ id: 's1', a: { x: 13, y: 13 }, b: { x: 13 + 6 * Math.cos(Math.PI / 8), y: 13 + 6 * Math.sin(Math.PI / 8) } }],
        patches: [
          { number: 1, anchor: { x: 16, y: 13.4 }, fabricId: 'ink' },
          { number: 2, anchor: { x: 15.5, y: 14.6 }, fabricId: 'sage' },
        ],
        ringRepeat: { count: 8, centre: c },
      },
      {
        id: 'ring',
        label: 'B',
        geometry: { kind: 'arc', centre: c, innerRadiusIn: 5, outerRadiusIn: 8, startAngleDeg: 0, sweepDeg: 45 },
        patches: [
          {
            number: 1,
            anchor: { x: 13 + 6.5 * Math.cos(Math.PI / 8), y: 13 + 6.5 * Math.sin(Math.PI / 8) },
            stripSet: {
              id: 'stripe',
              name: 'Centre stripe',
              strips: [
                { fabricId: 'plum', finishedWidthIn: 2 },
                { fabricId: 'oat', finishedWidthIn: 1 },
                { fabricId: 'plum', finishedWidthIn: 2 },
              ],
              axisAngleDeg: 22.5,
            },
          },
        ],
        ringRepeat: { count: 8, centre: c },
      },
      {
        id: 'corner',
        label: 'C',
        geometry: { kind: 'straight', vertices: corner },
        patches: [{ number: 1, anchor: { x: 1, y: 1 }, fabricId: 'sage' }],
      },
    ],
  });
}

/** The misnumbered strip of the shared fixtures (A2 shares no seam with A1): not sewable as numbered. */
export function unsewableStrip(): PatternDocument {
  return readPatternDocument(misnumberedStrip());
}

/** A bare piece template of one cutting line (sewing line the same, no seams or marks), for packing tests. */
export function templateOfRing(ring: Point[], copies: number, freeRotation: boolean): Omit<PrintTemplate, 'id' | 'sectionId' | 'sectionLabel'> {
  return {
    kind: freeRotation ? 'arc' : 'straight',
    sewingLine: ring,
    cuttingLine: ring,
    seams: [],
    patches: [],
    guideLines: [],
    matchingMarks: [],
    orientation: { direction: { x: 0, y: -1 }, towards: 'top of block' },
    freeRotation,
    copies,
    areaSqIn: Math.abs(polygonArea(ring)),
  };
}
