import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { API } from '../core/api-paths';
import type { Upload } from '../core/api-types';

/** A reference image stored with a pattern (the shared contract's shape). */
export type { Upload };

/** Images accepted as references (the server checks the bytes, not the name). */
export const REFERENCE_IMAGE_TYPES = ['image/png', 'image/jpeg', 'image/webp'];
/** Largest reference image, bytes (10 MB). */
export const MAX_REFERENCE_IMAGE_BYTES = 10 * 1024 * 1024;

/** Reference images of a pattern: upload, address of the file. */
@Injectable({ providedIn: 'root' })
export class UploadsService {
  private readonly http = inject(HttpClient);

  upload(patternId: string, file: File): Observable<Upload> {
    const body = new FormData();
    body.append('file', file, file.name);
    return this.http.post<{ upload: Upload }>(API.uploads(patternId), body).pipe(map((r) => r.upload));
  }

  fileUrl(patternId: string, uploadId: string): string {
    return API.uploadFile(patternId, uploadId);
  }
}
