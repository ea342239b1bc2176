import type { PatternDocument, Section } from '../document/pattern-schema';
import { round6, seam, sectionLetters } from './demo-helpers';

/** Most patches one stress pattern holds (2,000 sections of 10). */
export const MAX_STRESS_PATCHES = 20_000;

const FABRIC_IDS = ['plum', 'oat', 'sage', 'marigold', 'ink'] as const;

/**
 * A large generated pattern for benchmarks: `patchCount` patches in 4 × 3 in. string-pieced sections of
 * up to 10 patches each (slanted seams side by side, sewable left to right), laid out on a grid. Every
 * seventh section carries a strip-set patch. Deterministic: the same count gives the same document.
 */
export function buildStressPattern(patchCount = 1000): PatternDocument {
  if (!Number.isInteger(patchCount) || patchCount < 1 || patchCount > MAX_STRESS_PATCHES) {
    throw new RangeError(`patch count must be a whole number from 1 to ${MAX_STRESS_PATCHES}, got ${patchCount}`);
  }
  const perSection = 10;
  const sectionCount = Math.ceil(patchCount / perSection);
  const columns = Math.ceil(Math.sqrt(sectionCount));
  const rows = Math.ceil(sectionCount / columns);
  const sections: Section[] = [];
  for (let s = 0; s < sectionCount; s++) {
    const k = Math.min(perSection, patchCount - s * perSection);
    const x0 = (s % columns) * 5 + 0.5;
    const y0 = Math.floor(s / columns) * 4 + 0.5;
    const w = 4;
    const h = 3;
    const slant = 0.15 * (s % 2 === 0 ? 1 : -1);
    const seams = Array.from({ length: k - 1 }, (_, i) => {
      const x = x0 + (w * (i + 1)) / k;
      return seam(`s${i + 1}`, { x: round6(x - slant), y: y0 }, { x: round6(x + slant), y: y0 + h });
    });
    const patches = Array.from({ length: k }, (_, i) => {
      const patch: Section['patches'][number] = { number: i + 1, anchor: { x: round6(x0 + (w * (i + 0.5)) / k), y: y0 + h / 2 } };
      if (s % 7 === 3 && i === Math.floor(k / 2)) {
        patch.stripSet = {
          id: 'stress-stripe',
          strips: [{ fabricId: 'plum', finishedWidthIn: 0.5 }, { fabricId: 'oat', finishedWidthIn: 0.25 }, { fabricId: 'plum', finishedWidthIn: 0.5 }],
          axisAngleDeg: 90,
          offsetIn: 0,
        };
      } else {
        patch.fabricId = FABRIC_IDS[(s + i) % FABRIC_IDS.length];
      }
      return patch;
    });
    sections.push({
      id: `s${s + 1}`,
      label: sectionLetters(s),
      geometry: { kind: 'straight', vertices: [{ x: x0, y: y0 }, { x: x0 + w, y: y0 }, { x: x0 + w, y: y0 + h }, { x: x0, y: y0 + h }] },
      seams,
      patches,
    });
  }
  return {
    formatVersion: 2,
    title: `Stress pattern, ${patchCount} patches`,
    displayUnit: 'in',
    seamAllowanceIn: 0.25,
    piecingMarginIn: 0.5,
    blockCount: 1,
    pressingsPerTemplate: 16,
    canvas: { widthIn: columns * 5, heightIn: rows * 4 },
    fabrics: [
      { id: 'plum', name: 'Plum', colour: '#6d3b5e', usableWofIn: 42 },
      { id: 'oat', name: 'Oat', colour: '#e9dcc1', usableWofIn: 42 },
      { id: 'sage', name: 'Sage', colour: '#9aae8c', usableWofIn: 42 },
      { id: 'marigold', name: 'Marigold', colour: '#e2a03a', usableWofIn: 42 },
      { id: 'ink', name: 'Ink', colour: '#262b3d', usableWofIn: 42 },
    ],
    sections,
  };
}
