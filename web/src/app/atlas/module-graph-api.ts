import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import type { ModuleGraph, ModuleLevel, ModuleRecord } from './module-graph';

/** Reads a snapshot's module map (`/api/snapshots/:id/module-graph`) and one module's figures. */
@Injectable({ providedIn: 'root' })
export class ModuleGraphApi {
  private readonly http = inject(HttpClient);

  /** The modules, weighted links and clusters of one level. */
  get(snapshotId: string, level: ModuleLevel): Observable<ModuleGraph> {
    return this.http.get<ModuleGraph>(`/api/snapshots/${encodeURIComponent(snapshotId)}/module-graph`, {
      params: { level },
    });
  }

  /** All figures of one module, with the reasons for its gravity. */
  module(snapshotId: string, moduleId: string): Observable<ModuleRecord> {
    return this.http
      .get<{ module: ModuleRecord }>(`/api/snapshots/${encodeURIComponent(snapshotId)}/modules/${encodeURIComponent(moduleId)}`)
      .pipe(map((body) => body.module));
  }
}
