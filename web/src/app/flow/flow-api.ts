import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { FunctionDetail } from './flow-types';

/** Reads one function's flow graph, paths and coverage from the API. */
@Injectable({ providedIn: 'root' })
export class FlowApi {
  private readonly http = inject(HttpClient);

  /** Everything the Flow screen shows about one function of a snapshot. */
  functionDetail(snapshotId: string, functionId: string): Observable<FunctionDetail> {
    return this.http.get<FunctionDetail>(
      `/api/snapshots/${encodeURIComponent(snapshotId)}/functions/${encodeURIComponent(functionId)}`,
    );
  }
}
