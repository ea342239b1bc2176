import { describe, expect, it } from 'vitest';
import { canonicalJson, pdfDateUtc, stableHash128 } from './deterministic-ids';

describe('stableHash128', () => {
  // Values written by the first (lane-array) form of the hash: print sets keep the file identifiers they had.
  it('gives the identifiers earlier print sets were written with', () => {
    expect(stableHash128('')).toBe('204EDD992F31CC48C566DDCAFC2951FF');
    expect(stableHash128('Seamwright')).toBe('347D08C6496DAB865C6BED10C3ABFF1E');
    expect(stableHash128(canonicalJson({ b: '日本', a: [1, 2, 3] }))).toBe('132E69D65FE6F3D3FACDB3CEEFD0EB81');
  });

  it('tells texts one character apart', () => {
    expect(stableHash128('Seamwright')).not.toBe(stableHash128('Seamwrighs'));
    expect(stableHash128('ab')).not.toBe(stableHash128('ba'));
  });
});

describe('pdfDateUtc', () => {
  it('writes a time in UTC and holds later years at the end of 2037', () => {
    expect(pdfDateUtc('2026-12-01T10:20:30+02:00')).toBe("D:20261201082030+00'00'");
    expect(pdfDateUtc('2100-01-01T00:00:00Z')).toBe("D:20371231235959+00'00'");
  });
});
