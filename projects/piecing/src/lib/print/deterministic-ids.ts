/**
 * Values that make PDF output reproducible: a file identifier derived from the input (never random)
 * and the PDF date string of a fixed creation time.
 */

/**
 * A 128-bit hash of a string as 32 hex digits (four 32-bit FNV-1a lanes with different offsets,
 * cross-mixed at the end). Not cryptographic: it only has to be stable and spread well.
 */
export function stableHash128(text: string): string {
  // The four lanes in locals (lane l takes code + l), for speed on a whole pattern's JSON.
  let h0 = 0x811c9dc5;
  let h1 = (0x01000193 ^ 0x9e3779b9) >>> 0;
  let h2 = 0x85ebca6b;
  let h3 = 0xc2b2ae35;
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    h0 = Math.imul(h0 ^ code, 0x01000193) >>> 0;
    h1 = Math.imul(h1 ^ (code + 1), 0x01000193) >>> 0;
    h2 = Math.imul(h2 ^ (code + 2), 0x01000193) >>> 0;
    h3 = Math.imul(h3 ^ (code + 3), 0x01000193) >>> 0;
  }
  const lanes = [h0, h1, h2, h3];
  for (let l = 0; l < 4; l++) {
    let h = lanes[l] ^ lanes[(l + 1) % 4];
    h = Math.imul(h ^ (h >>> 16), 0x85ebca6b) >>> 0;
    h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35) >>> 0;
    lanes[l] = (h ^ (h >>> 16)) >>> 0;
  }
  return lanes.map((v) => v.toString(16).padStart(8, '0')).join('').toUpperCase();
}

/**
 * The PDF date string (ISO 32000-1 §7.9.4) of an ISO 8601 time, in UTC: `D:YYYYMMDDHHmmSS+00'00'`.
 * jsPDF accepts years 1970–2037 only; later times are written as the last second of 2037.
 */
export function pdfDateUtc(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) throw new RangeError(`not a date: ${iso}`);
  const limit = Date.UTC(2037, 11, 31, 23, 59, 59);
  const d = new Date(Math.min(Math.max(date.getTime(), 0), limit));
  const two = (n: number) => String(n).padStart(2, '0');
  return `D:${d.getUTCFullYear()}${two(d.getUTCMonth() + 1)}${two(d.getUTCDate())}${two(d.getUTCHours())}${two(d.getUTCMinutes())}${two(d.getUTCSeconds())}+00'00'`;
}

/** JSON with object keys sorted, so equal values always give equal text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.keys(v as object).sort().map((k) => [k, (v as Record<string, unknown>)[k]]))
      : v,
  );
}
