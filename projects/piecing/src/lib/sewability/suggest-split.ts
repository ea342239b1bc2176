import type { Point } from '../document/pattern-schema';
import { formatPoint } from '../geometry/vector';
import type { PreparedPatches } from './check-sewability';
import type { OrderSearch } from './order-search';
import { patchSideOfLine } from './patch-contacts';
import type { SplitSuggestion } from './sewability-types';

interface CandidateLine {
  origin: Point;
  ux: number;
  uy: number;
}

/** What the split advice found, and whether it looked at every candidate cut within the budget. */
export interface SplitAdvice {
  suggestion: SplitSuggestion | null;
  complete: boolean;
}

/**
 * Looks for one straight cut along existing seams that divides the patches into two groups, each lying
 * wholly on one side of the cut and each sewable on its own. Prefers the most even split. Asks the
 * section's {@link OrderSearch}, so the sets the failed search proved unsewable, its self-blocking core
 * and its work budget carry over; when the budget runs out it keeps the best cut found so far.
 */
export function suggestSplit(prepared: PreparedPatches, search: OrderSearch): SplitAdvice {
  const { patches, graph } = prepared;
  const contacts = graph.contacts;
  const n = patches.length;
  const tol = 1e-6;
  const candidates: Array<{ line: CandidateLine; k: number; li: number }> = [];
  const sameLine = (a: CandidateLine, p: Point, ux: number, uy: number) =>
    Math.abs(a.ux * uy - a.uy * ux) < 1e-9 && Math.abs(-a.uy * (p.x - a.origin.x) + a.ux * (p.y - a.origin.y)) <= tol;
  contacts.forEach((c, k) => {
    c.lines.forEach((l, li) => {
      if (l.shared.size === 0) return;
      if (candidates.some((cand) => sameLine(cand.line, l.origin, l.ux, l.uy))) return;
      candidates.push({ line: { origin: l.origin, ux: l.ux, uy: l.uy }, k, li });
    });
  });
  let best: { suggestion: SplitSuggestion; imbalance: number } | null = null;
  for (const { line, k, li } of candidates) {
    const side = (j: number) => patchSideOfLine(graph, k, li, j);
    const plus: number[] = [];
    const minus: number[] = [];
    let straddles = false;
    for (let j = 0; j < n; j++) {
      const s = side(j);
      if (s === 1) plus.push(j);
      else if (s === -1) minus.push(j);
      else {
        straddles = true;
        break;
      }
    }
    if (straddles || plus.length === 0 || minus.length === 0) continue;
    const imbalance = Math.abs(plus.length - minus.length);
    if (best && imbalance >= best.imbalance) continue;
    const a = search.search(plus);
    if (!a.found && a.limitHit) return { suggestion: best?.suggestion ?? null, complete: false };
    if (!a.found) continue;
    const b = search.search(minus);
    if (!b.found && b.limitHit) return { suggestion: best?.suggestion ?? null, complete: false };
    if (!b.found) continue;
    // The cut runs over the stretches the two groups share along the line.
    let lo = Infinity;
    let hi = -Infinity;
    for (const i of plus) {
      for (const cl of contacts[i].lines) {
        const parallel = Math.abs(cl.ux * line.uy - cl.uy * line.ux) < 1e-9;
        if (!parallel || Math.abs(-line.uy * (cl.origin.x - line.origin.x) + line.ux * (cl.origin.y - line.origin.y)) > tol) continue;
        for (const j of minus) {
          for (const [t0, t1] of cl.shared.get(j) ?? []) {
            for (const t of [t0, t1]) {
              const p = { x: cl.origin.x + cl.ux * t, y: cl.origin.y + cl.uy * t };
              const along = line.ux * (p.x - line.origin.x) + line.uy * (p.y - line.origin.y);
              lo = Math.min(lo, along);
              hi = Math.max(hi, along);
            }
          }
        }
      }
    }
    const from = { x: line.origin.x + line.ux * lo, y: line.origin.y + line.uy * lo };
    const to = { x: line.origin.x + line.ux * hi, y: line.origin.y + line.uy * hi };
    const partA = a.order.map((i) => patches[i].number);
    const partB = b.order.map((i) => patches[i].number);
    const labelsOf = (order: number[]) => order.map((i) => patches[i].label).join(', ');
    best = {
      imbalance,
      suggestion: {
        from,
        to,
        parts: [partA, partB],
        message: `cut it along the seam from ${formatPoint(from)} to ${formatPoint(to)} into two sections, sewn ${labelsOf(a.order)} and ${labelsOf(b.order)}`,
      },
    };
    if (imbalance <= 1) break;
  }
  return { suggestion: best?.suggestion ?? null, complete: true };
}
