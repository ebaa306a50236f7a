import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, OnInit, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Subscription } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import type { Codebase, Role, Snapshot } from '../api-types';
import { SessionStore } from '../auth/session-store';
import { CodebasesApi } from './codebases-api';
import { CodebaseSummary } from './codebase-summary';
import { isUnfinished } from './headline-figures';
import { SnapshotProgress } from './snapshot-progress';
import { UploadDialog, UploadDialogData, UploadDialogResult } from './upload-dialog';

/** What the screen is showing. */
type OverviewState =
  | { kind: 'loading' }
  | { kind: 'failed'; message: string }
  | { kind: 'loaded'; codebases: Codebase[] };

/**
 * Unfinished snapshots followed by event stream; the rest are polled. Each stream holds one of
 * the browser's six connections per server, and the upload dialog may need one more.
 */
const MAX_STREAMS = 2;

/** Roles that may upload (the server refuses the others anyway). */
const UPLOADERS: readonly Role[] = ['owner', 'architect'];

/**
 * Overview screen: each codebase with its latest ready snapshot's figures, V(G) histogram and
 * top gravity modules, and all its snapshots; unfinished analyses update live. Owners and
 * architects upload zips from here.
 */
@Component({
  selector: 'sl-overview',
  imports: [CodebaseSummary, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './overview.html',
  styleUrl: './overview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Overview implements OnInit {
  private readonly codebasesApi = inject(CodebasesApi);
  private readonly progress = inject(SnapshotProgress);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
  private readonly role = inject(SessionStore).role;
  /** Live follows of unfinished snapshots, replaced on every load. */
  private follows = new Subscription();
  private loading: Subscription | null = null;

  /** Loading, failed or loaded. */
  protected readonly state = signal<OverviewState>({ kind: 'loading' });
  /** The reason the last load failed, or null. */
  protected readonly failure = computed(() => {
    const state = this.state();
    return state.kind === 'failed' ? state.message : null;
  });
  /** The codebases once loaded; empty otherwise. */
  protected readonly codebases = computed(() => {
    const state = this.state();
    return state.kind === 'loaded' ? state.codebases : [];
  });
  /** Whether the person may upload zips. */
  protected readonly canUpload = computed(() => {
    const role = this.role();
    return role !== null && UPLOADERS.includes(role);
  });

  constructor() {
    this.destroyRef.onDestroy(() => this.follows.unsubscribe());
  }

  ngOnInit(): void {
    this.loadCodebases();
  }

  /** Fetches the codebases (also the Retry button's action); `quietly` keeps the screen while it loads. */
  protected loadCodebases(quietly = false): void {
    if (!quietly || this.state().kind !== 'loaded') this.state.set({ kind: 'loading' });
    this.loading?.unsubscribe();
    this.loading = this.codebasesApi
      .list()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (codebases) => {
          this.state.set({ kind: 'loaded', codebases });
          this.followUnfinished(codebases);
        },
        error: (error: unknown) => this.state.set({ kind: 'failed', message: apiErrorMessage(error) }),
      });
  }

  /** Opens the upload dialog; the list loads again when it closes. */
  protected openUpload(): void {
    const data: UploadDialogData = { codebases: this.codebases() };
    this.dialog
      .open<UploadDialog, UploadDialogData, UploadDialogResult>(UploadDialog, {
        data,
        width: '640px',
        maxWidth: '95vw',
        autoFocus: 'first-tabbable',
      })
      .afterClosed()
      .subscribe((result) => {
        // Closing with Escape gives no result; load anyway, something may have been created.
        if (result?.changed !== false) this.loadCodebases(true);
      });
  }

  /** Keeps queued and running snapshots up to date; when one ends, the list loads again for its figures. */
  private followUnfinished(codebases: readonly Codebase[]): void {
    this.follows.unsubscribe();
    this.follows = new Subscription();
    const unfinished = codebases.flatMap((codebase) => codebase.snapshots).filter(isUnfinished);
    unfinished.forEach((snapshot, index) => {
      const updates =
        index < MAX_STREAMS ? this.progress.follow(snapshot.id) : this.progress.followByPolling(snapshot.id);
      this.follows.add(
        updates.subscribe({
          next: (update) => {
            if (update.kind === 'snapshot' && isUnfinished(update.snapshot)) this.replaceSnapshot(update.snapshot);
          },
          complete: () => this.loadCodebases(true),
          error: () => undefined, // the row keeps its last known state; Retry or a reload asks again
        }),
      );
    });
  }

  /** Puts a newer state of a snapshot into the loaded list. */
  private replaceSnapshot(next: Snapshot): void {
    this.state.update((state) =>
      state.kind !== 'loaded'
        ? state
        : {
            kind: 'loaded',
            codebases: state.codebases.map((codebase) =>
              codebase.snapshots.some((s) => s.id === next.id)
                ? { ...codebase, snapshots: codebase.snapshots.map((s) => (s.id === next.id ? { ...s, ...next } : s)) }
                : codebase,
            ),
          },
    );
  }
}
