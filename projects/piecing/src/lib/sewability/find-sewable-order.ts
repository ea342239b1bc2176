import { preparePatches, type PreparedPatches, type SewabilityInput } from './check-sewability';
import { DEFAULT_SEARCH_BUDGET, OrderSearch, type SubsetSearch } from './order-search';
import type { SewabilityOptions, SewableOrderResult } from './sewability-types';
import { suggestSplit } from './suggest-split';

export { DEFAULT_SEARCH_BUDGET, OrderSearch, type SubsetSearch } from './order-search';

/** Default work budget of one order search (see {@link DEFAULT_SEARCH_BUDGET}); the old name. */
export const DEFAULT_MAX_SEARCH_STATES = DEFAULT_SEARCH_BUDGET;

/** Share of the budget the first search may spend; the split advice has the rest (and what the search left). */
const FIRST_SEARCH_SHARE = 0.75;

/**
 * One search over some of the patches (indices into `prepared.patches`) with its own budget: see
 * {@link OrderSearch.search}. Returns indices into `prepared.patches`.
 */
export function searchSubset(prepared: PreparedPatches, subset: readonly number[], maxStates = DEFAULT_SEARCH_BUDGET): SubsetSearch {
  return new OrderSearch(prepared, maxStates).search(subset);
}

/**
 * Finds an order in which the section (or its derived patches) can be sewn. When none exists, says so
 * and, where one straight cut along existing seams would do, suggests cutting the section there into
 * two sections that can each be sewn. One work budget covers the search and the advice; when it runs
 * out before the search can tell, the answer is `undecided` (never a guess). Never throws for valid input.
 */
export function findSewableOrder(input: SewabilityInput, options: SewabilityOptions = {}): SewableOrderResult {
  const prepared = preparePatches(input, options);
  const budget = options.maxSearchStates ?? DEFAULT_SEARCH_BUDGET;
  const search = new OrderSearch(prepared, Math.floor(budget * FIRST_SEARCH_SHARE));
  const result = search.search(prepared.patches.map((_, i) => i));
  if (result.found) {
    const order = result.order.map((i) => prepared.patches[i].number);
    const labels = result.order.map((i) => prepared.patches[i].label);
    return { found: true, status: 'sewable', order, labels, message: `can be sewn in the order ${labels.join(', ')}` };
  }
  const section = sectionLabelOf(prepared);
  search.budget = budget;
  const advice = suggestSplit(prepared, search);
  const suggestion = advice.suggestion;
  if (result.limitHit) {
    const head = `the search could not tell in time whether section ${section} can be sewn in some order`;
    const message = suggestion ? `${head}; ${suggestion.message}` : `${head}; split it into smaller sections, or set an order by hand and check it`;
    return suggestion ? { found: false, status: 'undecided', reason: 'search-limit', message, suggestion } : { found: false, status: 'undecided', reason: 'search-limit', message };
  }
  const message = suggestion
    ? `section ${section} cannot be sewn in any order; ${suggestion.message}`
    : advice.complete
      ? `section ${section} cannot be sewn in any order, and no single straight cut along its seams gives two sewable sections; split it into more sections`
      : `section ${section} cannot be sewn in any order, and no straight cut into two sewable sections turned up in time; split it into more sections`;
  return suggestion ? { found: false, status: 'unsewable', reason: 'none', message, suggestion } : { found: false, status: 'unsewable', reason: 'none', message };
}

function sectionLabelOf(prepared: PreparedPatches): string {
  const first = prepared.patches[0];
  return first ? first.label.replace(/\d+$/, '') : '?';
}
