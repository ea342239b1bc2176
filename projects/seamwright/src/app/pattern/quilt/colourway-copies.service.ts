import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { ColourwayCopy, ColourwayCopyFabric, CreateColourwayCopyBody, UpdateColourwayCopyBody } from '@seamwright/api';
import { API } from '../../core/api-paths';

const copies = (patternId: string) => `${API.pattern(patternId)}/colourway-copies`;
const copy = (patternId: string, copyId: string) => `${copies(patternId)}/${encodeURIComponent(copyId)}`;

/** The signed-in user's own copies of a pattern's colourways (docs/api.md "Colourway copies"). */
@Injectable({ providedIn: 'root' })
export class ColourwayCopiesService {
  private readonly http = inject(HttpClient);

  list(patternId: string): Observable<ColourwayCopy[]> {
    return this.http.get<{ items: ColourwayCopy[] }>(copies(patternId)).pipe(map((r) => r.items));
  }

  /** Copies a colourway of the latest revision, or the pattern's own fabrics (`null`). */
  create(patternId: string, colourwayId: string | null): Observable<ColourwayCopy> {
    return this.http.post<{ copy: ColourwayCopy }>(copies(patternId), { colourwayId } satisfies CreateColourwayCopyBody).pipe(map((r) => r.copy));
  }

  /** Saves a name and every fabric slot on top of `version`; a stale version answers 409 with the copy as it is. */
  update(patternId: string, copyId: string, version: number, change: { name?: string; fabrics?: Record<string, ColourwayCopyFabric> }): Observable<ColourwayCopy> {
    return this.http.patch<{ copy: ColourwayCopy }>(copy(patternId, copyId), { version, ...change } satisfies UpdateColourwayCopyBody).pipe(map((r) => r.copy));
  }

  delete(patternId: string, copyId: string): Observable<unknown> {
    return this.http.delete(copy(patternId, copyId));
  }
}
