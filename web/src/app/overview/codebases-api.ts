import {
  HttpBackend,
  HttpClient,
  HttpEventType,
  HttpHeaders,
  HttpXhrBackend,
  HttpXsrfTokenExtractor,
} from '@angular/common/http';
import { inject, Injectable, InjectionToken } from '@angular/core';
import { filter, map, Observable } from 'rxjs';

import type { Codebase, CodebaseListResponse, Snapshot } from '../api-types';

/** `POST /api/codebases/:id/snapshots` → 202: the queued snapshot and where to follow it. */
export interface QueuedUpload {
  snapshot: Snapshot;
  links: { status: string; events: string };
}

/** What an upload reports: bytes sent so far, then the queued snapshot. */
export type UploadEvent =
  | { kind: 'sending'; loaded: number; total: number | null }
  | { kind: 'queued'; snapshot: Snapshot };

/** Optional labels of an uploaded snapshot. */
export interface UploadLabels {
  commit?: string;
  branch?: string;
}

/**
 * What sends uploads. The app's HttpClient goes through fetch, which cannot report the bytes a
 * request has sent, so uploads go through XMLHttpRequest; tests swap in the testing backend.
 */
export const UPLOAD_BACKEND = new InjectionToken<HttpBackend>('UPLOAD_BACKEND', {
  providedIn: 'root',
  factory: () => inject(HttpXhrBackend),
});

/** The header the API checks against its XSRF-TOKEN cookie on cookie-authenticated changes. */
const XSRF_HEADER = 'X-XSRF-TOKEN';

/** The workspace's codebases (`/api/codebases`): read them, create one, upload a zip into one. */
@Injectable({ providedIn: 'root' })
export class CodebasesApi {
  private readonly http = inject(HttpClient);
  // Bypasses the app's interceptors, so the anti-forgery header is added here by hand.
  private readonly uploads = new HttpClient(inject(UPLOAD_BACKEND));
  private readonly xsrfToken = inject(HttpXsrfTokenExtractor);

  /** Every codebase of the workspace with its snapshots, newest snapshot first. */
  list(): Observable<Codebase[]> {
    return this.http.get<CodebaseListResponse>('/api/codebases').pipe(map((body) => body.items));
  }

  /** Creates a codebase (owners and architects); it has no snapshots yet. */
  create(name: string): Observable<Codebase> {
    return this.http
      .post<{ codebase: Omit<Codebase, 'snapshots'> }>('/api/codebases', { name })
      .pipe(map((body) => ({ ...body.codebase, snapshots: [] })));
  }

  /**
   * Uploads a zip as a new snapshot of the codebase (multipart field `file`, with `commit` and
   * `branch` when given). Emits the bytes sent as they go, then the queued snapshot.
   */
  upload(codebaseId: string, file: Blob, labels: UploadLabels = {}): Observable<UploadEvent> {
    const form = new FormData();
    // Labels before the file, so the server has them before it streams the zip.
    if (labels.commit) form.append('commit', labels.commit);
    if (labels.branch) form.append('branch', labels.branch);
    form.append('file', file, file instanceof File ? file.name : 'upload.zip');
    const token = this.xsrfToken.getToken();
    return this.uploads
      .post<QueuedUpload>(`/api/codebases/${encodeURIComponent(codebaseId)}/snapshots`, form, {
        headers: token ? new HttpHeaders({ [XSRF_HEADER]: token }) : undefined,
        reportProgress: true,
        observe: 'events',
      })
      .pipe(
        map((event): UploadEvent | null => {
          if (event.type === HttpEventType.UploadProgress) {
            return { kind: 'sending', loaded: event.loaded, total: event.total ?? null };
          }
          if (event.type === HttpEventType.Response && event.body) {
            return { kind: 'queued', snapshot: event.body.snapshot };
          }
          return null;
        }),
        filter((event): event is UploadEvent => event !== null),
      );
  }
}
