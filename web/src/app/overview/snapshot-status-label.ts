import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { Snapshot, SnapshotStatus } from '../api-types';

/** Icon per status, so the state never rests on colour alone (the word is always shown too). */
const ICONS: Record<SnapshotStatus, string> = {
  queued: 'schedule',
  running: 'autorenew',
  ready: 'check_circle',
  failed: 'error',
};

/** A snapshot's analysis state as a small label: icon, word and, while running, progress. */
@Component({
  selector: 'sl-snapshot-status-label',
  imports: [MatIconModule],
  template: `
    <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
    <span>{{ text() }}</span>
  `,
  styleUrl: './snapshot-status-label.scss',
  host: {
    '[class]': '"status status-" + snapshot().status',
    '[attr.title]': 'snapshot().error',
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SnapshotStatusLabel {
  /** The snapshot whose state is shown. */
  readonly snapshot = input.required<Snapshot>();

  /** Material Symbols name for the state. */
  protected readonly icon = computed(() => ICONS[this.snapshot().status]);
  /** The state in words, with progress while running. */
  protected readonly text = computed(() => {
    const { status, progress } = this.snapshot();
    return status === 'running' ? `running ${Math.round(progress)}%` : status;
  });
}
