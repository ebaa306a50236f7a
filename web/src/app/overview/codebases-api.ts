import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import type { Codebase, CodebaseListResponse } from '../api-types';

/** Reads the workspace's codebases from `/api/codebases`. */
@Injectable({ providedIn: 'root' })
export class CodebasesApi {
  private readonly http = inject(HttpClient);

  /** Every codebase of the workspace with its snapshots, newest snapshot first. */
  list(): Observable<Codebase[]> {
    return this.http.get<CodebaseListResponse>('/api/codebases').pipe(map((body) => body.items));
  }
}
