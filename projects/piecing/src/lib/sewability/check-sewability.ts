import type { Section } from '../document/pattern-schema';
import { derivePatches, type DerivedPatch } from '../geometry/derive-patches';
import { GEOMETRY_EPSILON_IN, SEAM_REACH_TOLERANCE_IN } from '../tolerance';
import { canAdd, computeContacts, pointOnLine, type AddCheck, type ContactGraph } from './patch-contacts';
import type { SewabilityFailureReason, SewabilityOptions, SewabilityVerdict, SewingStep } from './sewability-types';

/** What the sewability check reads of a patch: its number, label and outline. */
export type SewabilityPatch = Pick<DerivedPatch, 'number' | 'label' | 'polygon'>;

/** Patches to check: a section (its patches are derived) or patches derived already. */
export type SewabilityInput = Section | readonly SewabilityPatch[];

/** The patches of the input, and the precomputed contacts between them. */
export interface PreparedPatches {
  patches: readonly SewabilityPatch[];
  graph: ContactGraph;
  gapIn: number;
}

/** Derives (when given a section) and precomputes what the check and the search need. */
export function preparePatches(input: SewabilityInput, options: SewabilityOptions = {}): PreparedPatches {
  const patches = Array.isArray(input) ? (input as readonly SewabilityPatch[]) : derivePatches(input as Section, { toleranceIn: options.chordToleranceIn }).patches;
  const toleranceIn = options.toleranceIn ?? GEOMETRY_EPSILON_IN;
  const graph = computeContacts(
    patches.map((p) => p.polygon),
    toleranceIn,
    options.minSeamLengthIn ?? SEAM_REACH_TOLERANCE_IN,
  );
  return { patches, graph, gapIn: options.minSeamLengthIn ?? SEAM_REACH_TOLERANCE_IN };
}

/** Explains a failed step in words a quilter understands. */
export function explainFailure(prepared: PreparedPatches, k: number, check: Exclude<AddCheck, { ok: true }>, earlierLabels: string[]): string {
  const label = prepared.patches[k].label;
  const before = earlierLabels.length === 1 ? earlierLabels[0] : `${earlierLabels[0]}–${earlierLabels[earlierLabels.length - 1]}`;
  const culprit = check.culprit !== undefined ? prepared.patches[check.culprit].label : undefined;
  switch (check.reason) {
    case 'no-shared-seam':
      return `${label} shares no seam with the patches sewn before it (${before}), so there is no line to sew it along`;
    case 'not-one-straight-seam':
      return `${label} meets the patches sewn before it (${before}) along more than one straight stretch${culprit ? ` (${culprit} adds another)` : ''}, so it cannot be sewn with one straight seam`;
    case 'earlier-patches-both-sides':
      return `the patches sewn before ${label} lie on both sides of the line of its seam${culprit ? ` (${culprit} crosses it)` : ''}; folding the foundation along that line would cut through sewn fabric`;
    case 'patch-crosses-seam-line':
      return `${label} reaches across the line of its own seam, so one piece of fabric flipped over that seam cannot cover it`;
  }
}

/**
 * Checks whether the patches can be sewn in `order` (patch numbers; default: ascending numbers), per
 * docs/design-notes.md#sewability: for every k ≥ 2, patch k meets the union of patches 1 … k−1 along one straight
 * segment and that union lies entirely on one side of the line through it (and patch k on the other).
 * Names the first failing patch and why. Never throws for valid patches; an order that does not list
 * every patch exactly once is reported as `order-mismatch`.
 */
export function checkSewability(input: SewabilityInput, order?: readonly number[], options: SewabilityOptions = {}): SewabilityVerdict {
  const prepared = preparePatches(input, options);
  return checkPrepared(prepared, order ?? prepared.patches.map((p) => p.number).sort((a, b) => a - b));
}

/** {@link checkSewability} on patches prepared already. */
export function checkPrepared(prepared: PreparedPatches, order: readonly number[]): SewabilityVerdict {
  const { patches, graph, gapIn } = prepared;
  const indexOf = new Map(patches.map((p, i) => [p.number, i]));
  const labels = order.map((n) => patches[indexOf.get(n) ?? -1]?.label ?? `#${n}`);
  const mismatch = orderMismatch(order, patches.map((p) => p.number));
  if (mismatch) {
    return { sewable: false, order: [...order], labels, steps: [], failure: { patchNumber: mismatch.number, label: `#${mismatch.number}`, position: mismatch.position, reason: 'order-mismatch' as SewabilityFailureReason, message: mismatch.message } };
  }
  const earlier = new Uint8Array(patches.length);
  const steps: SewingStep[] = [];
  for (let pos = 0; pos < order.length; pos++) {
    const k = indexOf.get(order[pos])!;
    if (pos > 0) {
      const check = canAdd(graph, k, earlier, gapIn);
      if (!check.ok) {
        const earlierLabels = labels.slice(0, pos);
        return {
          sewable: false,
          order: [...order],
          labels,
          steps,
          failure: { patchNumber: order[pos], label: patches[k].label, position: pos + 1, reason: check.reason, message: explainFailure(prepared, k, check, earlierLabels) },
        };
      }
      steps.push({ patchNumber: order[pos], label: patches[k].label, from: pointOnLine(graph, k, check.line, check.from), to: pointOnLine(graph, k, check.line, check.to) });
    }
    earlier[k] = 1;
  }
  return { sewable: true, order: [...order], labels, steps };
}

function orderMismatch(order: readonly number[], numbers: readonly number[]): { number: number; position: number; message: string } | null {
  const known = new Set(numbers);
  const seen = new Set<number>();
  for (let i = 0; i < order.length; i++) {
    const n = order[i];
    if (!known.has(n)) return { number: n, position: i + 1, message: `the order lists patch ${n}, which the section does not have` };
    if (seen.has(n)) return { number: n, position: i + 1, message: `the order lists patch ${n} twice` };
    seen.add(n);
  }
  const missing = numbers.find((n) => !seen.has(n));
  if (missing !== undefined) return { number: missing, position: order.length + 1, message: `the order leaves out patch ${missing}` };
  return null;
}
