import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { forkJoin, map, Observable } from 'rxjs';

import type { Snapshot, SnapshotResponse } from '../api-types';

/** Severity bands of V(G): calm 1–10, busy 11–20, tangled 21–50, knotted above 50. */
export type Band = 'calm' | 'busy' | 'tangled' | 'knotted';

/** The bands in rising order. */
export const BANDS: readonly Band[] = ['calm', 'busy', 'tangled', 'knotted'];

/** The V(G) range of each band, as shown beside its name. */
export const BAND_RANGES: Record<Band, string> = {
  calm: '1–10',
  busy: '11–20',
  tangled: '21–50',
  knotted: 'above 50',
};

/** How many functions fall into each band. */
export type BandCounts = Record<Band, number>;

/** One module of the gravity ranking, with the fields the Overview shows. */
export interface GravityModule {
  id: string;
  level: 'file' | 'folder' | 'package';
  path: string;
  name: string | null;
  functions: number;
  cyclomatic: number;
  gravity: number;
  gravityRank: number;
  reasons: string[];
}

/** `GET /api/snapshots/:id/gravity` → 200 (the fields read here). */
interface GravityRanking {
  level: string;
  modules: GravityModule[];
}

/** `GET /api/snapshots/:id/functions` → 200 (only the count is read here). */
interface FunctionPageCount {
  total: number;
}

/** Reads a snapshot's headline figures: its state, the band histogram and the top gravity modules. */
@Injectable({ providedIn: 'root' })
export class SnapshotFiguresApi {
  private readonly http = inject(HttpClient);

  /** The snapshot's state and totals (`GET /api/snapshots/:id`). */
  snapshot(snapshotId: string): Observable<Snapshot> {
    return this.http.get<SnapshotResponse>(snapshotUrl(snapshotId)).pipe(map((body) => body.snapshot));
  }

  /** The functions per band of a ready snapshot: one one-row page per band, reading its `total`. */
  bandCounts(snapshotId: string): Observable<BandCounts> {
    const count = (band: Band) =>
      this.http
        .get<FunctionPageCount>(`${snapshotUrl(snapshotId)}/functions`, {
          params: new HttpParams().set('band', band).set('pageSize', 1),
        })
        .pipe(map((page) => page.total));
    return forkJoin({ calm: count('calm'), busy: count('busy'), tangled: count('tangled'), knotted: count('knotted') });
  }

  /** The `limit` modules of highest gravity at folder level (409 without a module map). */
  topGravity(snapshotId: string, limit = 3): Observable<GravityModule[]> {
    return this.http
      .get<GravityRanking>(`${snapshotUrl(snapshotId)}/gravity`, {
        params: new HttpParams().set('level', 'folder').set('limit', limit),
      })
      .pipe(map((ranking) => ranking.modules));
  }
}

function snapshotUrl(snapshotId: string): string {
  return `/api/snapshots/${encodeURIComponent(snapshotId)}`;
}
