import { describe, expect, it } from 'vitest';
import { jsonDepthExceeds } from './json-bodies';

const bytes = (s: string) => Buffer.from(s, 'utf8');

describe('jsonDepthExceeds', () => {
  it('counts arrays and objects together, just inside and just past the limit', () => {
    expect(jsonDepthExceeds(bytes('[[[1]]]'), 3)).toBe(false);
    expect(jsonDepthExceeds(bytes('[[[[1]]]]'), 3)).toBe(true);
    expect(jsonDepthExceeds(bytes('{"a":[{"b":[]}]}'), 4)).toBe(false);
    expect(jsonDepthExceeds(bytes('{"a":[{"b":[{}]}]}'), 4)).toBe(true);
  });

  it('siblings do not add up: depth returns when a bracket closes', () => {
    expect(jsonDepthExceeds(bytes(`[${'[1],'.repeat(10_000)}[1]]`), 2)).toBe(false);
  });

  it('ignores brackets inside strings, also after escaped quotes and backslashes', () => {
    expect(jsonDepthExceeds(bytes(`["${'['.repeat(100)}"]`), 1)).toBe(false);
    expect(jsonDepthExceeds(bytes(`["a\\"[[[[", "\\\\", "{{{"]`), 1)).toBe(false);
    // After an escaped backslash the quote really closes the string, so the brackets after it count.
    expect(jsonDepthExceeds(bytes(`["\\\\",[[[]]]]`), 3)).toBe(true);
  });

  it('reads multi-byte UTF-8 text without miscounting', () => {
    expect(jsonDepthExceeds(bytes('{"title":"キルト ☂ [ 🧵 ]","x":[1]}'), 2)).toBe(false);
  });

  it('stops at once on the issue body of 4.9 MB of "["', () => {
    expect(jsonDepthExceeds(bytes('['.repeat(4_900_000)), 64)).toBe(true);
  });
});
