import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { API } from '../core/api-paths';
import type { SewingLogEntry, SewingStage } from '../core/api-types';

/** The signed-in quilter's sewing log for one pattern. */
@Injectable({ providedIn: 'root' })
export class SewingLogService {
  private readonly http = inject(HttpClient);

  get(patternId: string): Observable<SewingLogEntry[]> {
    return this.http.get<{ entries: SewingLogEntry[] }>(API.sewingLog(patternId)).pipe(map((r) => r.entries));
  }

  /** Records the stage a section has reached; `null` clears it. */
  mark(patternId: string, sectionId: string, stage: SewingStage | null): Observable<SewingLogEntry | null> {
    return this.http.put<{ entry: SewingLogEntry | null }>(API.sewingLogSection(patternId, sectionId), { stage }).pipe(map((r) => r.entry));
  }
}
