import { DatePipe, DecimalPipe, SlicePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, OnInit, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';

import { apiErrorMessage } from '../api-error-message';
import type { Codebase } from '../api-types';
import { CodebasesApi } from './codebases-api';
import { OverviewRow, overviewRows } from './overview-rows';
import { SnapshotStatusLabel } from './snapshot-status-label';

/** What the screen is showing. */
type OverviewState =
  | { kind: 'loading' }
  | { kind: 'failed'; message: string }
  | { kind: 'loaded'; codebases: Codebase[] };

/** Overview screen: the workspace's codebases and their snapshots. */
@Component({
  selector: 'sl-overview',
  imports: [
    DatePipe,
    DecimalPipe,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatTableModule,
    SlicePipe,
    SnapshotStatusLabel,
  ],
  templateUrl: './overview.html',
  styleUrl: './overview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Overview implements OnInit {
  private readonly codebasesApi = inject(CodebasesApi);
  private readonly destroyRef = inject(DestroyRef);

  /** Table columns, in order. */
  protected readonly columns = [
    'codebase',
    'snapshot',
    'status',
    'commit',
    'branch',
    'functions',
    'cyclomatic',
    'decisions',
  ];
  /** Loading, failed or loaded. */
  protected readonly state = signal<OverviewState>({ kind: 'loading' });
  /** The reason the last load failed, or null. */
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.kind === 'failed' ? state.message : null;
  });
  /** Table rows once loaded; empty otherwise. */
  protected readonly rows = computed(() => {
    const state = this.state();
    return state.kind === 'loaded' ? overviewRows(state.codebases) : [];
  });

  /** Keeps table rows stable across reloads. */
  protected readonly trackRow = (_index: number, row: OverviewRow): string => row.key;

  ngOnInit(): void {
    this.loadCodebases();
  }

  /** Fetches the codebases again (also the Retry button's action). */
  protected loadCodebases(): void {
    this.state.set({ kind: 'loading' });
    this.codebasesApi
      .list()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (codebases) => this.state.set({ kind: 'loaded', codebases }),
        error: (error: unknown) => this.state.set({ kind: 'failed', message: apiErrorMessage(error) }),
      });
  }
}
