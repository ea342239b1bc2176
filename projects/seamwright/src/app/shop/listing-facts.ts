import { showInches } from '../core/length-text';
import type { Listing } from './shop-types';

/** "3 sections · 8 × 8 in. finished", in the units quilters write. */
export function listingFacts(l: Pick<Listing, 'sectionCount' | 'finishedSize'>): string {
  const sections = `${l.sectionCount} ${l.sectionCount === 1 ? 'section' : 'sections'}`;
  if (!l.finishedSize) return sections;
  return `${sections} · ${showInches(l.finishedSize.widthIn)} × ${showInches(l.finishedSize.heightIn)} finished`;
}
