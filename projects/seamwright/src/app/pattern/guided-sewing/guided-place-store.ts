import type { GuidedPlace } from './sewing-guide-types';

const PREFIX = 'seamwright.guided-sewing.';

/** Where the quilter is in guided sewing, kept in this browser per user and pattern (localStorage). */
export class GuidedPlaceStore {
  /** The stored place for `key`, unchecked (callers check it against the pattern), or null. */
  read(key: string): unknown {
    try {
      const text = localStorage.getItem(PREFIX + key);
      return text ? (JSON.parse(text) as unknown) : null;
    } catch {
      return null;
    }
  }

  write(key: string, place: GuidedPlace): void {
    try {
      localStorage.setItem(PREFIX + key, JSON.stringify(place));
    } catch {
      // Storage full or refused (private mode): the place is simply not remembered.
    }
  }
}
