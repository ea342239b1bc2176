import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, catchError, map, switchMap, takeWhile, timer } from 'rxjs';
import { API } from '../core/api-paths';
import type { PrintSet } from '../core/api-types';
import { EVENT_SOURCE, serverEvents } from './server-events';

const finished = (s: PrintSet) => s.status === 'done' || s.status === 'failed';

/** Print sets: make one from a revision, follow its progress, download, delete. */
@Injectable({ providedIn: 'root' })
export class PrintSetsService {
  private readonly http = inject(HttpClient);
  private readonly eventSource = inject(EVENT_SOURCE);

  list(patternId: string): Observable<PrintSet[]> {
    return this.http.get<{ items: PrintSet[] }>(API.printSets(patternId)).pipe(map((r) => r.items));
  }

  /**
   * Queues a print set of `revision` (the latest when left out), in the fabrics of the user's own
   * colourway copy when `colourwayCopyId` is given.
   */
  create(patternId: string, options: object, revision?: number, colourwayCopyId?: string | null): Observable<PrintSet> {
    return this.http
      .post<{ printSet: PrintSet }>(API.printSets(patternId), { options, ...(revision ? { revision } : {}), ...(colourwayCopyId ? { colourwayCopyId } : {}) })
      .pipe(map((r) => r.printSet));
  }

  get(patternId: string, setId: string): Observable<PrintSet> {
    return this.http.get<{ printSet: PrintSet }>(API.printSet(patternId, setId)).pipe(map((r) => r.printSet));
  }

  /**
   * Each state of a print set until it is done or failed (the last one included), as the server's event
   * stream sends them; by polling every `everyMs` when the browser has no EventSource or the stream
   * fails on the way.
   */
  follow(patternId: string, setId: string, everyMs = 600): Observable<PrintSet> {
    const poll = this.poll(patternId, setId, everyMs);
    if (!this.eventSource) return poll;
    return serverEvents<PrintSet>(this.eventSource, API.printSetEvents(patternId, setId), 'progress', finished).pipe(catchError(() => poll));
  }

  /** Asks for a print set every `everyMs` until it is done or failed, emitting each state. */
  private poll(patternId: string, setId: string, everyMs: number): Observable<PrintSet> {
    return timer(0, everyMs).pipe(
      switchMap(() => this.get(patternId, setId)),
      takeWhile((s) => !finished(s), true),
    );
  }

  delete(patternId: string, setId: string): Observable<unknown> {
    return this.http.delete(API.printSet(patternId, setId));
  }

  /** The file's address, for a plain download link (same origin; the cookie goes along). */
  fileUrl(patternId: string, setId: string): string {
    return API.printSetFile(patternId, setId);
  }
}

/** A size in bytes as people read it. */
export const formatBytes = (n: number | null | undefined): string =>
  n == null ? '' : n < 1024 ? `${n} B` : n < 1024 * 1024 ? `${(n / 1024).toFixed(0)} kB` : `${(n / 1024 / 1024).toFixed(1)} MB`;

/** Progress 0…1 as a whole percentage. */
export const percent = (p: number): number => Math.round(Math.max(0, Math.min(1, p)) * 100);
