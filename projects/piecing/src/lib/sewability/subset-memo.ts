/**
 * Sets of patches as bitmasks, and a memo of sets by bitmask key, at any number of patches
 * (docs/design-notes.md#sewability). A set is a `Uint32Array` of ⌈n / 32⌉ words (bit i of word i >> 5
 * is patch i). Its key is a number: the mask itself while it fits a double exactly (n ≤ 52), else a
 * 52-bit Zobrist hash (one random word pair per patch, XOR-ed in and out as patches come and go) whose
 * buckets keep copies of the masks, so two sets that share a hash are still told apart. No strings.
 */

/** Patches up to this many have their mask itself as key (2^52 is exact in a double). */
export const EXACT_KEY_PATCHES = 52;

/** A set of patches over `n` patches: the words of its bitmask. */
export type PatchMask = Uint32Array;

/** An empty set over `n` patches. */
export function emptyMask(n: number): PatchMask {
  return new Uint32Array(Math.max(1, Math.ceil(n / 32)));
}

/** Whether patch `i` is in the set. */
export function hasPatch(mask: PatchMask, i: number): boolean {
  return (mask[i >>> 5] & (1 << (i & 31))) !== 0;
}

/** Whether the two sets share a patch. */
export function intersects(a: PatchMask, b: PatchMask): boolean {
  for (let w = 0; w < a.length; w++) if ((a[w] & b[w]) !== 0) return true;
  return false;
}

/** Number of patches in the set. */
export function maskSize(mask: PatchMask): number {
  let count = 0;
  for (let w = 0; w < mask.length; w++) {
    let v = mask[w];
    v = v - ((v >>> 1) & 0x55555555);
    v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
    count += (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
  }
  return count;
}

/** The patches of the set, in increasing index. */
export function maskMembers(mask: PatchMask): number[] {
  const out: number[] = [];
  for (let w = 0; w < mask.length; w++) {
    let v = mask[w];
    while (v !== 0) {
      const bit = 31 - Math.clz32(v & -v);
      out.push(w * 32 + bit);
      v &= v - 1;
    }
  }
  return out;
}

/** Two well-mixed 32-bit words for patch `i` (a fixed hash of its index, so keys are reproducible). */
function zobristWords(i: number): [number, number] {
  // splitmix32-style finalisers of two different streams (public-domain mixing constants).
  const mix = (x: number) => {
    x = Math.imul(x ^ (x >>> 16), 0x7feb352d);
    x = Math.imul(x ^ (x >>> 15), 0x846ca68b);
    return (x ^ (x >>> 16)) >>> 0;
  };
  return [mix(i * 2 + 0x9e3779b9), mix(i * 2 + 1 + 0x632be5ab)];
}

/**
 * A set of patches being searched: its mask and its key, both kept up to date as patches are taken
 * out and put back (O(1) per change).
 */
export class KeyedMask {
  readonly mask: PatchMask;
  private readonly exact: boolean;
  private readonly low: Uint32Array;
  private readonly high: Uint32Array;
  private hashLow = 0;
  private hashHigh = 0;
  private exactKey = 0;

  /**
   * @param n number of patches
   * @param hashWords Zobrist words per patch (tests give colliding ones); default: a fixed hash of the index
   */
  constructor(readonly n: number, hashWords: (i: number) => [number, number] = zobristWords, forceHashed = false) {
    this.mask = emptyMask(n);
    this.exact = n <= EXACT_KEY_PATCHES && !forceHashed;
    this.low = new Uint32Array(this.exact ? 0 : n);
    this.high = new Uint32Array(this.exact ? 0 : n);
    if (!this.exact) {
      for (let i = 0; i < n; i++) {
        const [lo, hi] = hashWords(i);
        this.low[i] = lo;
        this.high[i] = hi & 0xfffff; // 20 + 32 bits: the key stays an exact integer
      }
    }
  }

  /** Whether keys are the masks themselves (else hashes that a {@link SubsetMemo} checks against the mask). */
  get exactKeys(): boolean {
    return this.exact;
  }

  /** Adds or removes patch `i` (it must not be, or must be, in the set). */
  toggle(i: number): void {
    const bit = 1 << (i & 31);
    const word = i >>> 5;
    const adding = (this.mask[word] & bit) === 0;
    this.mask[word] ^= bit;
    if (this.exact) this.exactKey += adding ? 2 ** i : -(2 ** i);
    else {
      this.hashLow = (this.hashLow ^ this.low[i]) >>> 0;
      this.hashHigh ^= this.high[i];
    }
  }

  /** Sets the members to exactly `members`. */
  reset(members: Iterable<number>): void {
    for (const i of maskMembers(this.mask)) this.toggle(i);
    for (const i of members) if (!hasPatch(this.mask, i)) this.toggle(i);
  }

  /** The set's key: an integer below 2^53. */
  get key(): number {
    return this.exact ? this.exactKey : this.hashHigh * 2 ** 32 + this.hashLow;
  }
}

/** Sets of patches remembered by key; with hashed keys each bucket holds copies of its masks. */
export class SubsetMemo {
  private readonly exactSet = new Set<number>();
  private readonly buckets = new Map<number, PatchMask | PatchMask[]>();
  private count = 0;

  /** How many sets are remembered. */
  get size(): number {
    return this.count;
  }

  /** Whether the set (as it is now) is remembered. */
  has(set: KeyedMask): boolean {
    if (set.exactKeys) return this.exactSet.has(set.key);
    const bucket = this.buckets.get(set.key);
    if (!bucket) return false;
    if (bucket instanceof Uint32Array) return sameMask(bucket, set.mask);
    return bucket.some((m) => sameMask(m, set.mask));
  }

  /** Remembers the set (as it is now). */
  add(set: KeyedMask): void {
    if (this.has(set)) return;
    this.count++;
    if (set.exactKeys) {
      this.exactSet.add(set.key);
      return;
    }
    const copy = set.mask.slice();
    const bucket = this.buckets.get(set.key);
    if (!bucket) this.buckets.set(set.key, copy);
    else if (bucket instanceof Uint32Array) this.buckets.set(set.key, [bucket, copy]);
    else bucket.push(copy);
  }
}

function sameMask(a: PatchMask, b: PatchMask): boolean {
  for (let w = 0; w < a.length; w++) if (a[w] !== b[w]) return false;
  return true;
}
