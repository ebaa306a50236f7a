import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { concatMap, map, Observable, of, Subscription, tap } from 'rxjs';

import { apiErrorMessage } from '../api-error-message';
import type { Codebase, Snapshot } from '../api-types';
import { snapshotScreenPath } from '../snapshot/current-snapshot';
import { CodebasesApi } from './codebases-api';
import { formatBytes, phaseLabel } from './headline-figures';
import { SnapshotProgress } from './snapshot-progress';

/** What the Overview passes to the dialog. */
export interface UploadDialogData {
  /** The workspace's codebases to choose from. */
  codebases: readonly Codebase[];
  /** The codebase chosen at first, if any. */
  codebaseId?: string;
}

/** What the dialog gives back when it closes. */
export interface UploadDialogResult {
  /** Whether a codebase or snapshot was created (the Overview then loads again). */
  changed: boolean;
}

/** Where the upload stands. */
type UploadStage =
  | { kind: 'form' }
  | { kind: 'sending'; loaded: number; total: number | null }
  | { kind: 'analysing'; snapshot: Snapshot }
  | { kind: 'ready'; snapshot: Snapshot }
  | { kind: 'failed'; snapshot: Snapshot }
  | { kind: 'gone' }
  | { kind: 'lost'; snapshot: Snapshot; message: string };

/** The select's value for "make a new codebase". */
export const NEW_CODEBASE = '__new__';

/** The server's rule for a commit label. */
const COMMIT_PATTERN = /^[0-9A-Za-z._-]{1,64}$/;

/**
 * Upload a zip of a codebase: choose (or name a new) codebase, pick the zip, add commit and
 * branch if known; then watch the bytes go up and the analysis run until it is ready or failed.
 */
@Component({
  selector: 'sl-upload-dialog',
  imports: [
    DecimalPipe,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './upload-dialog.html',
  styleUrl: './upload-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadDialog {
  private readonly codebasesApi = inject(CodebasesApi);
  private readonly progress = inject(SnapshotProgress);
  private readonly dialogRef = inject<MatDialogRef<UploadDialog, UploadDialogResult>>(MatDialogRef);
  private readonly destroyRef = inject(DestroyRef);
  private readonly data = inject<UploadDialogData>(MAT_DIALOG_DATA);
  private work: Subscription | null = null;
  /** Whether anything was created on the server. */
  private changed = false;

  /** A codebase made in this dialog (its upload may still have been refused). */
  private readonly madeHere = signal<Codebase | null>(null);
  /** The codebases to choose from. */
  protected readonly codebases = computed(() => {
    const made = this.madeHere();
    return made ? [...this.data.codebases, made] : this.data.codebases;
  });
  protected readonly newCodebase = NEW_CODEBASE;
  /** The form's fields. */
  protected readonly form = new FormGroup({
    codebase: new FormControl(this.data.codebaseId ?? this.data.codebases[0]?.id ?? NEW_CODEBASE, {
      nonNullable: true,
      validators: [Validators.required],
    }),
    newName: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
    commit: new FormControl('', { nonNullable: true, validators: [Validators.pattern(COMMIT_PATTERN)] }),
    branch: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(255)] }),
  });
  /** The zip chosen. */
  protected readonly file = signal<File | null>(null);
  /** Whether the person tried to send without a file. */
  protected readonly fileMissing = signal(false);
  /** Whether the new codebase's name is missing on send. */
  protected readonly nameMissing = signal(false);
  /** The server's refusal of the last attempt, shown above the form. */
  protected readonly refusal = signal<string | null>(null);
  /** Where the upload stands. */
  protected readonly stage = signal<UploadStage>({ kind: 'form' });
  /** Whether the new-codebase name field is shown. */
  protected readonly isNewCodebase = signal(this.form.controls.codebase.value === NEW_CODEBASE);
  /** The percent of bytes sent, or null while the size is unknown. */
  protected readonly sentPercent = computed(() => {
    const stage = this.stage();
    return stage.kind === 'sending' && stage.total ? Math.round((100 * stage.loaded) / stage.total) : null;
  });

  /** The phase of the analysis, in words. */
  protected readonly phaseLabel = phaseLabel;
  /** A file size in words. */
  protected readonly formatBytes = formatBytes;

  constructor() {
    this.form.controls.codebase.valueChanges.pipe(takeUntilDestroyed()).subscribe((value) => {
      this.isNewCodebase.set(value === NEW_CODEBASE);
      this.nameMissing.set(false);
    });
    this.dialogRef.beforeClosed().subscribe(() => this.work?.unsubscribe());
  }

  /** Takes the file from the file input. */
  protected pickFile(input: HTMLInputElement): void {
    this.file.set(input.files?.item(0) ?? null);
    this.fileMissing.set(false);
    this.refusal.set(null);
  }

  /** Sends the zip (after creating the codebase if it is new), then follows its analysis. */
  protected send(): void {
    const file = this.file();
    const { codebase, newName, commit, branch } = this.form.getRawValue();
    const name = newName.trim();
    this.fileMissing.set(file === null);
    this.nameMissing.set(codebase === NEW_CODEBASE && name === '');
    this.form.markAllAsTouched();
    if (!file || this.form.invalid || this.nameMissing()) return;

    this.refusal.set(null);
    this.stage.set({ kind: 'sending', loaded: 0, total: file.size });
    const target: Observable<string> = codebase === NEW_CODEBASE ? this.createCodebase(name) : of(codebase);
    this.work = target
      .pipe(
        concatMap((codebaseId) => this.codebasesApi.upload(codebaseId, file, { commit: commit.trim(), branch: branch.trim() })),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (event) => {
          if (event.kind === 'sending') {
            this.stage.set({ kind: 'sending', loaded: event.loaded, total: event.total ?? file.size });
          } else {
            this.changed = true;
            this.follow(event.snapshot);
          }
        },
        error: (error: unknown) => {
          this.refusal.set(apiErrorMessage(error));
          this.stage.set({ kind: 'form' });
        },
      });
  }

  /** Stops what is under way (an upload in flight is aborted) and closes. */
  protected close(): void {
    this.work?.unsubscribe();
    this.dialogRef.close({ changed: this.changed });
  }

  /** The route of the snapshot's Functions screen. */
  protected functionsPath(snapshot: Snapshot): string {
    return snapshotScreenPath(snapshot.id, 'functions');
  }

  /** Creates the new codebase; a later attempt goes into it rather than making a second one. */
  private createCodebase(name: string): Observable<string> {
    return this.codebasesApi.create(name).pipe(
      tap((created) => {
        this.changed = true;
        this.madeHere.set(created);
        this.form.controls.codebase.setValue(created.id);
      }),
      map((created) => created.id),
    );
  }

  /** Follows the queued snapshot until its analysis ends. */
  private follow(queued: Snapshot): void {
    this.stage.set({ kind: 'analysing', snapshot: queued });
    this.work = this.progress
      .follow(queued.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (update) => {
          if (update.kind === 'gone') {
            this.stage.set({ kind: 'gone' });
            return;
          }
          const snapshot = update.snapshot;
          if (snapshot.status === 'ready') this.stage.set({ kind: 'ready', snapshot });
          else if (snapshot.status === 'failed') this.stage.set({ kind: 'failed', snapshot });
          else this.stage.set({ kind: 'analysing', snapshot });
        },
        error: (error: unknown) => {
          const stage = this.stage();
          const snapshot = stage.kind === 'analysing' ? stage.snapshot : queued;
          this.stage.set({ kind: 'lost', snapshot, message: apiErrorMessage(error) });
        },
      });
  }
}
