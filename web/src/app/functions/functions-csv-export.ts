import { DOCUMENT } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { computed, DestroyRef, inject, Injectable, signal } from '@angular/core';
import type { Subscription } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import { collectFunctionRows, type ExportProgress } from './collect-function-rows';
import { downloadText } from './download-text';
import { FunctionsApi } from './functions-api';
import { functionsCsv } from './functions-csv';
import type { FunctionQuery } from './functions-types';

/** A CSV export under way, failed, or none. */
export type CsvExportState =
  | { kind: 'idle' }
  | { kind: 'running'; fetched: number; total: number }
  | { kind: 'failed'; message: string };

/** What one export takes: the snapshot, the table's filters and order, and the file to write. */
export interface CsvExportRequest {
  snapshotId: string;
  query: FunctionQuery;
  withCoverage: boolean;
  /** Rows expected (the table's total), for the progress bar until the first page arrives. */
  total: number;
  fileName: string;
}

/**
 * The Functions screen's CSV export: fetches every row of the current filters page by page, in
 * the table's order, with progress, and hands the file to the browser. One per screen (provided
 * by the component); an export under way stops when the screen goes.
 */
@Injectable()
export class FunctionsCsvExport {
  private readonly api = inject(FunctionsApi);
  private readonly document = inject(DOCUMENT);
  private subscription: Subscription | null = null;

  /** The export's state. */
  readonly state = signal<CsvExportState>({ kind: 'idle' });
  /** Progress in percent. */
  readonly percent = computed(() => {
    const state = this.state();
    return state.kind === 'running' && state.total > 0 ? Math.round((state.fetched / state.total) * 100) : 0;
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.subscription?.unsubscribe());
  }

  /** Starts an export unless one is under way. */
  start({ snapshotId, query, withCoverage, total, fileName }: CsvExportRequest): void {
    if (this.state().kind === 'running') return;
    this.state.set({ kind: 'running', fetched: 0, total });
    this.subscription = collectFunctionRows((page, pageSize) => this.api.page(snapshotId, { ...query, page, pageSize })).subscribe({
      next: (progress: ExportProgress) => {
        if (progress.kind === 'progress') {
          this.state.set({ kind: 'running', fetched: progress.fetched, total: progress.total });
          return;
        }
        downloadText(this.document, fileName, functionsCsv(progress.rows, withCoverage));
        this.state.set({ kind: 'idle' });
      },
      error: (error: unknown) =>
        this.state.set({
          kind: 'failed',
          message: error instanceof HttpErrorResponse ? apiErrorMessage(error) : (error as Error).message,
        }),
    });
  }

  /** Stops an export under way. */
  cancel(): void {
    this.subscription?.unsubscribe();
    this.subscription = null;
    this.state.set({ kind: 'idle' });
  }

  /** Hides a failure message. */
  dismiss(): void {
    this.state.set({ kind: 'idle' });
  }
}
