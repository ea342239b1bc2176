import type { PreparedPatches } from './check-sewability';
import { mergeIntervals, patchSideOfLine } from './patch-contacts';
import { KeyedMask, SubsetMemo, emptyMask, hasPatch, intersects, maskMembers, type PatchMask } from './subset-memo';

/**
 * Default work budget of one order search, split advice included (units of {@link OrderSearch.steps}).
 * Spent in about 30 ms on an idle core of the benchmark machine at every size up to the schema's 500
 * patches (bench/sewability.bench.ts), so a call stays well under 250 ms on a busy one.
 */
export const DEFAULT_SEARCH_BUDGET = 150_000;

/** Outcome of a search over some of the patches (indices into the prepared patches). */
export type SubsetSearch = { found: true; order: number[] } | { found: false; limitHit: boolean };

/** Side masks of one line of one patch: which other patches lie on its + side, − side, or across it. */
interface LineSides {
  plus: PatchMask;
  minus: PatchMask;
  across: PatchMask;
}

/**
 * The order search of one section (docs/design-notes.md#sewability), with everything it learns kept
 * for the next question about the same patches: the split advice asks about parts of the section and
 * reuses the sets the first search proved unsewable, the self-blocking core and the same work budget.
 *
 * Work is counted, not timed, so the answer is the same on every machine: a patch tried as the last
 * of a set costs 1 unit, plus units that grow with the words of the section's bitmasks when it meets
 * the set along one line and its sides must be read (1 more at 32 patches or fewer, 5 at 500); a set
 * expanded costs 1 + size / 16 (it is checked for pieces that share no seam). So the budget bounds
 * the time at any size.
 * When the budget runs out the search says so (`limitHit`) and never guesses.
 */
export class OrderSearch {
  /** Work spent so far (patches tried + sets expanded), over every question asked. */
  steps = 0;
  private readonly n: number;
  private readonly failed = new SubsetMemo();
  private readonly set: KeyedMask;
  /** Per patch: its neighbours (patches it shares a seam with) and the line of each (−2: more than one line). */
  private readonly neighbours: Int32Array[];
  private readonly neighbourLine: Int32Array[];
  /** Per patch: the patches it shares a seam with, either way round. */
  private readonly adjacent: Int32Array[];
  private readonly sides: Array<Array<LineSides | undefined>>;
  private selfBlocking: PatchMask | null = null;
  private readonly scratch: Array<[number, number]> = [];
  private readonly queue: Int32Array;
  /** Units one try costs: grows with the number of 32-patch words in a mask. */
  private readonly unit: number;

  /**
   * @param budget work allowed over every question asked (see {@link steps}); may be raised between questions
   * @param selfBlockingCheck whether a subset holding a self-blocking group is ruled out at once (the
   *   benchmark turns it off to time the search where it has to try every set)
   */
  constructor(
    private readonly prepared: PreparedPatches,
    public budget = DEFAULT_SEARCH_BUDGET,
    private readonly selfBlockingCheck = true,
  ) {
    const { graph } = prepared;
    this.n = prepared.patches.length;
    this.set = new KeyedMask(this.n);
    this.queue = new Int32Array(this.n);
    this.unit = 1 + (this.set.mask.length >> 2);
    this.neighbours = graph.contacts.map((c) => Int32Array.from(c.linesTouching.keys()));
    this.neighbourLine = graph.contacts.map((c) => Int32Array.from(c.linesTouching.values(), (lines) => (lines.every((li) => li === lines[0]) ? lines[0] : -2)));
    const both = this.neighbours.map((nb) => new Set(nb));
    this.neighbours.forEach((nb, k) => nb.forEach((j) => both[j].add(k)));
    this.adjacent = both.map((s) => Int32Array.from(s));
    this.sides = graph.contacts.map((c) => c.lines.map(() => undefined));
  }

  /** Whether the budget is spent. */
  get exhausted(): boolean {
    return this.steps > this.budget;
  }

  /**
   * Searches a sewable order of `subset` (indices into the prepared patches): a set can be sewn when
   * some patch of it can be sewn last onto the rest and the rest can be sewn. Highest numbers are
   * tried last-first, so a sewable designer's numbering tends to come back unchanged. Sets proved
   * unsewable are remembered; a set that holds a self-blocking group, or falls apart into pieces
   * that share no seam, is unsewable without trying it.
   */
  search(subset: readonly number[]): SubsetSearch {
    if (subset.length === 0) return { found: true, order: [] };
    const { patches } = this.prepared;
    const tryOrder = [...subset].sort((a, b) => patches[b].number - patches[a].number);
    if (!this.selfBlockingCheck || subset.length === 1) return this.depthFirst(subset, tryOrder, this.budget);
    // A short look first: a sewable set numbered near a sewable order is found in a few tries per
    // patch, without working out the self-blocking group.
    const quick = this.depthFirst(subset, tryOrder, Math.min(this.budget, this.steps + 4 * subset.length * (this.unit + 1)));
    if (quick.found || !quick.limitHit || this.exhausted) return quick;
    if (this.holdsSelfBlockingGroup(subset)) return { found: false, limitHit: false };
    return this.depthFirst(subset, tryOrder, this.budget);
  }

  /** Whether the subset holds a self-blocking group (every such group lies inside the section's core). */
  holdsSelfBlockingGroup(subset: readonly number[]): boolean {
    const core = this.blockingCore();
    const within = emptyMask(this.n);
    for (const i of subset) if (hasPatch(core, i)) within[i >>> 5] |= 1 << (i & 31);
    return this.coreWithin(within).length > 0;
  }

  /** The remove-last search with memo over subsets, until `limit` steps have been spent in all. */
  private depthFirst(subset: readonly number[], tryOrder: readonly number[], limit: number): SubsetSearch {
    this.set.reset(subset);
    const order: number[] = [];
    let limitHit = false;
    const set = this.set;
    const solve = (size: number): boolean => {
      if (size === 1) {
        order.push(tryOrder.find((i) => hasPatch(set.mask, i))!);
        return true;
      }
      if (this.failed.has(set)) return false;
      this.steps += 1 + (size >> 4);
      if (this.steps > limit) {
        limitHit = true;
        return false;
      }
      if (!this.connected(set.mask, size)) {
        this.failed.add(set);
        return false;
      }
      for (const k of tryOrder) {
        if (!hasPatch(set.mask, k)) continue;
        set.toggle(k);
        const ok = this.canAddLast(k, set.mask) && solve(size - 1);
        set.toggle(k);
        if (ok) {
          order.push(k);
          return true;
        }
        if (limitHit) return false;
      }
      this.failed.add(set);
      return false;
    };
    return solve(subset.length) ? { found: true, order } : { found: false, limitHit };
  }

  /**
   * Whether patch `k` can be sewn onto the patches of `earlier` (k not in it): the rule of `canAdd`
   * in patch-contacts.ts, read off bitmasks — one line of contact, one unbroken stretch along it, the
   * patch on one side of it and every earlier patch on the other.
   */
  canAddLast(k: number, earlier: PatchMask): boolean {
    this.steps++;
    const line = this.contactLine(k, earlier);
    if (line < 0) return false;
    this.steps += this.unit;
    const contacts = this.prepared.graph.contacts[k];
    const l = contacts.lines[line];
    const pieces = this.scratch;
    pieces.length = 0;
    for (const [j, intervals] of l.shared) if (hasPatch(earlier, j)) for (const iv of intervals) pieces.push(iv);
    if (pieces.length > 1 && mergeIntervals(pieces, this.prepared.gapIn).length > 1) return false;
    return !this.sidesBlock(k, line, earlier);
  }

  /** The one line along which k meets `earlier`; −1 when it meets none, −2 when it meets more than one. */
  private contactLine(k: number, earlier: PatchMask): number {
    const nb = this.neighbours[k];
    const nl = this.neighbourLine[k];
    let line = -1;
    for (let t = 0; t < nb.length; t++) {
      if (!hasPatch(earlier, nb[t])) continue;
      const li = nl[t];
      if (li === -2) return -2;
      if (line < 0) line = li;
      else if (li !== line) return -2;
    }
    return line;
  }

  /** Whether k itself reaches across `line`, or `earlier` has patches across it or on both sides. */
  private sidesBlock(k: number, line: number, earlier: PatchMask): boolean {
    if (this.prepared.graph.contacts[k].lines[line].ownSide === 2) return true;
    const s = this.lineSides(k, line);
    return intersects(earlier, s.across) || (intersects(earlier, s.plus) && intersects(earlier, s.minus));
  }

  private lineSides(k: number, line: number): LineSides {
    let s = this.sides[k][line];
    if (!s) {
      s = { plus: emptyMask(this.n), minus: emptyMask(this.n), across: emptyMask(this.n) };
      for (let j = 0; j < this.n; j++) {
        if (j === k) continue;
        const side = patchSideOfLine(this.prepared.graph, k, line, j);
        const m = side === 1 ? s.plus : side === -1 ? s.minus : side === 2 ? s.across : null;
        if (m) m[j >>> 5] |= 1 << (j & 31);
      }
      this.sides[k][line] = s;
    }
    return s;
  }

  /**
   * Whether k can never be sewn after all of `earlier`, nor after any larger set: it already meets
   * them along two lines, or along one line that it or they cross. (A gap in the stretch, or no
   * contact at all, may still be mended by patches sewn later, so those do not count.)
   */
  private blockedForGood(k: number, earlier: PatchMask): boolean {
    const line = this.contactLine(k, earlier);
    if (line === -2) return true;
    if (line < 0) return false;
    return this.sidesBlock(k, line, earlier);
  }

  /**
   * The largest self-blocking group within `within`: patches each of which is blocked for good by the
   * others of the group. A set that holds such a group cannot be sewn (whichever of the group comes
   * last in any order finds the others before it), however the rest is ordered. Found by taking out
   * patches that are not blocked by the rest until none is left to take out (taking one out can
   * only unblock others); what remains holds every self-blocking group.
   */
  coreWithin(within: PatchMask): number[] {
    const core = within.slice();
    let members = maskMembers(core);
    let changed = true;
    while (changed && members.length > 0) {
      changed = false;
      for (const k of members) {
        core[k >>> 5] &= ~(1 << (k & 31));
        if (this.blockedForGood(k, core)) core[k >>> 5] |= 1 << (k & 31);
        else changed = true;
      }
      members = maskMembers(core);
    }
    return members;
  }

  /** The self-blocking core of the whole section (indices), found once: empty when there is none. */
  core(): number[] {
    return maskMembers(this.blockingCore());
  }

  private blockingCore(): PatchMask {
    if (!this.selfBlocking) {
      const all = emptyMask(this.n);
      for (let i = 0; i < this.n; i++) all[i >>> 5] |= 1 << (i & 31);
      const core = emptyMask(this.n);
      for (const i of this.coreWithin(all)) core[i >>> 5] |= 1 << (i & 31);
      this.selfBlocking = core;
    }
    return this.selfBlocking;
  }

  /** Whether the patches of the set (size ≥ 2) hang together through shared seams: every sewable set does. */
  private connected(mask: PatchMask, size: number): boolean {
    const seen = emptyMask(this.n);
    const queue = this.queue;
    let first = -1;
    for (let w = 0; w < mask.length && first < 0; w++) if (mask[w] !== 0) first = w * 32 + (31 - Math.clz32(mask[w] & -mask[w]));
    let head = 0;
    let tail = 0;
    queue[tail++] = first;
    seen[first >>> 5] |= 1 << (first & 31);
    while (head < tail) {
      const k = queue[head++];
      const nb = this.adjacent[k];
      for (let t = 0; t < nb.length; t++) {
        const j = nb[t];
        if (!hasPatch(mask, j) || hasPatch(seen, j)) continue;
        seen[j >>> 5] |= 1 << (j & 31);
        queue[tail++] = j;
      }
    }
    return tail === size;
  }
}
