import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { ModuleGraph, ModuleLevel } from './module-graph';

/** Reads a snapshot's module map from `/api/snapshots/:id/module-graph`. */
@Injectable({ providedIn: 'root' })
export class ModuleGraphApi {
  private readonly http = inject(HttpClient);

  /** The modules, weighted links and clusters of one level. */
  get(snapshotId: string, level: ModuleLevel): Observable<ModuleGraph> {
    return this.http.get<ModuleGraph>(`/api/snapshots/${encodeURIComponent(snapshotId)}/module-graph`, {
      params: { level },
    });
  }
}
