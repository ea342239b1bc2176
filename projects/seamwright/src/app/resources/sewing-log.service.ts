import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { API } from '../core/api-paths';
import type { SewingLogEntry, SewingStage, SewingStageBody } from '../core/api-types';

/** The signed-in quilter's sewing log for one pattern: a stage per copy of each section. */
@Injectable({ providedIn: 'root' })
export class SewingLogService {
  private readonly http = inject(HttpClient);

  get(patternId: string): Observable<SewingLogEntry[]> {
    return this.http.get<{ entries: SewingLogEntry[] }>(API.sewingLog(patternId)).pipe(map((r) => r.entries));
  }

  /** Records the stage one copy of a section has reached (copies count from 1); `null` clears it. */
  mark(patternId: string, sectionId: string, copy: number, stage: SewingStage | null): Observable<SewingLogEntry | null> {
    return this.http.put<{ entry: SewingLogEntry | null }>(API.sewingLogSection(patternId, sectionId), { stage, copy } satisfies SewingStageBody).pipe(map((r) => r.entry));
  }
}
