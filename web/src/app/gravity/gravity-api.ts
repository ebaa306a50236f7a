import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { GravityRanking, ModuleLevel } from './gravity-types';

/** Reads a snapshot's god-module ranking from `/api/snapshots/:id/gravity`. */
@Injectable({ providedIn: 'root' })
export class GravityApi {
  private readonly http = inject(HttpClient);

  /**
   * The `limit` strongest candidates at `level`, strongest first, each with reasons and trend.
   * Fails with 409 `no_module_map` for a snapshot made without the call graph.
   */
  ranking(snapshotId: string, level: ModuleLevel, limit: number): Observable<GravityRanking> {
    return this.http.get<GravityRanking>(`/api/snapshots/${encodeURIComponent(snapshotId)}/gravity`, {
      params: { level, limit },
    });
  }
}
