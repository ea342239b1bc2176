import type { PatternAccess } from '../core/api-types';

/** Plain words for a user's access to a pattern. */
export function accessLabel(access: PatternAccess): string {
  return access === 'owner' ? 'Owner' : access === 'co-designer' ? 'Co-designer' : 'Quilter';
}
