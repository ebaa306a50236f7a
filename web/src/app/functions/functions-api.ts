import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { forkJoin, map, Observable } from 'rxjs';

import type { Snapshot, SnapshotResponse } from '../api-types';
import { apiParamsFromQuery } from './function-query';
import type {
  ClusterSummary,
  FunctionPage,
  FunctionQuery,
  ClusterListResponse,
  ModuleLevel,
  ModuleListResponse,
  ModuleOption,
  SnapshotCoverage,
} from './functions-types';

/** A snapshot summary with the coverage report it carries (null without one). */
export type SnapshotWithCoverage = Snapshot & { coverage?: SnapshotCoverage | null };

/** Module levels offered by the module filter, broadest first. */
const FILTER_LEVELS: readonly ModuleLevel[] = ['package', 'folder', 'file'];

/** Reads a snapshot's functions, and the modules and clusters its filters offer, from `/api/snapshots/:id/…`. */
@Injectable({ providedIn: 'root' })
export class FunctionsApi {
  private readonly http = inject(HttpClient);

  /** One page of the snapshot's functions, sorted and filtered by the server. */
  page(snapshotId: string, query: FunctionQuery): Observable<FunctionPage> {
    return this.http.get<FunctionPage>(`${base(snapshotId)}/functions`, { params: apiParamsFromQuery(query) });
  }

  /** The snapshot's summary (status, settings, coverage). */
  snapshot(snapshotId: string): Observable<SnapshotWithCoverage> {
    return this.http
      .get<SnapshotResponse>(base(snapshotId))
      .pipe(map((body) => body.snapshot as SnapshotWithCoverage));
  }

  /** Every package, folder and file module of the snapshot, in that order. */
  modules(snapshotId: string): Observable<ModuleOption[]> {
    return forkJoin(
      FILTER_LEVELS.map((level) =>
        this.http
          .get<ModuleListResponse>(`${base(snapshotId)}/modules`, { params: { level } })
          .pipe(map((body) => body.items.map(({ id, path, functions }) => ({ id, level, path, functions })))),
      ),
    ).pipe(map((lists) => lists.flatMap((list) => [...list].sort((a, b) => a.path.localeCompare(b.path)))));
  }

  /** The snapshot's file-level clusters, the ids function rows carry. */
  clusters(snapshotId: string): Observable<ClusterSummary[]> {
    return this.http
      .get<ClusterListResponse>(`${base(snapshotId)}/clusters`, { params: { level: 'file' } })
      .pipe(map((body) => body.items.map(({ id, members, functions, cyclomatic }) => ({ id, members, functions, cyclomatic }))));
  }
}

function base(snapshotId: string): string {
  return `/api/snapshots/${encodeURIComponent(snapshotId)}`;
}
