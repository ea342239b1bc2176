import { canAdd } from './patch-contacts';
import { preparePatches, type PreparedPatches, type SewabilityInput } from './check-sewability';
import type { SewabilityOptions, SewableOrderResult } from './sewability-types';
import { suggestSplit } from './suggest-split';

/** Default cap on the subsets one order search visits. */
export const DEFAULT_MAX_SEARCH_STATES = 200_000;

/** Outcome of a search over some of the patches (indices into the prepared patches). */
export type SubsetSearch = { found: true; order: number[] } | { found: false; limitHit: boolean };

/**
 * Remove-last-patch search with memo over subsets (docs/design-notes.md#sewability): a set S of patches can be sewn when
 * some k in S can be sewn last onto S \ {k} and S \ {k} can be sewn. Subsets found unsewable are
 * remembered, so each is examined once. Highest numbers are tried last-first, so a sewable designer's
 * numbering tends to come back unchanged. Returns indices into `prepared.patches`.
 */
export function searchSubset(prepared: PreparedPatches, subset: readonly number[], maxStates = DEFAULT_MAX_SEARCH_STATES): SubsetSearch {
  const { patches, graph, gapIn } = prepared;
  const n = patches.length;
  if (subset.length === 0) return { found: true, order: [] };
  const inSet = new Uint8Array(n);
  for (const i of subset) inSet[i] = 1;
  const small = n <= 30;
  let mask = 0;
  if (small) for (const i of subset) mask |= 1 << i;
  const key = (): number | string => (small ? mask : inSet.join(''));
  const tryOrder = [...subset].sort((a, b) => patches[b].number - patches[a].number);
  const failed = new Set<number | string>();
  const order: number[] = [];
  let states = 0;
  let limitHit = false;

  const solve = (size: number): boolean => {
    if (size === 1) {
      order.push(tryOrder.find((i) => inSet[i])!);
      return true;
    }
    const here = key();
    if (failed.has(here)) return false;
    if (++states > maxStates) {
      limitHit = true;
      return false;
    }
    for (const k of tryOrder) {
      if (!inSet[k]) continue;
      inSet[k] = 0;
      if (small) mask ^= 1 << k;
      const ok = canAdd(graph, k, inSet, gapIn).ok && solve(size - 1);
      inSet[k] = 1;
      if (small) mask ^= 1 << k;
      if (ok) {
        order.push(k);
        return true;
      }
      if (limitHit) return false;
    }
    failed.add(here);
    return false;
  };

  return solve(subset.length) ? { found: true, order } : { found: false, limitHit };
}

/**
 * Finds an order in which the section (or its derived patches) can be sewn. When none exists, says so
 * and, where one straight cut along existing seams would do, suggests cutting the section there into
 * two sections that can each be sewn. Never throws for valid input.
 */
export function findSewableOrder(input: SewabilityInput, options: SewabilityOptions = {}): SewableOrderResult {
  const prepared = preparePatches(input, options);
  const maxStates = options.maxSearchStates ?? DEFAULT_MAX_SEARCH_STATES;
  const all = prepared.patches.map((_, i) => i);
  const result = searchSubset(prepared, all, maxStates);
  if (result.found) {
    const order = result.order.map((i) => prepared.patches[i].number);
    const labels = result.order.map((i) => prepared.patches[i].label);
    return { found: true, order, labels, message: `can be sewn in the order ${labels.join(', ')}` };
  }
  const section = sectionLabelOf(prepared);
  if (result.limitHit) {
    return { found: false, reason: 'search-limit', message: `the search for a sewing order of section ${section} stopped after ${maxStates} steps without an answer; split the section into smaller ones` };
  }
  const suggestion = suggestSplit(prepared, maxStates);
  const message = suggestion
    ? `section ${section} cannot be sewn in any order; ${suggestion.message}`
    : `section ${section} cannot be sewn in any order, and no single straight cut along its seams gives two sewable sections; split it into more sections`;
  return suggestion ? { found: false, reason: 'none', message, suggestion } : { found: false, reason: 'none', message };
}

function sectionLabelOf(prepared: PreparedPatches): string {
  const first = prepared.patches[0];
  return first ? first.label.replace(/\d+$/, '') : '?';
}
