import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { RouterLink } from '@angular/router';

import type { ModuleLink } from './atlas-graph';
import { moduleLabel, type ModuleNode, type ModuleRecord } from './module-graph';
import { snapshotScreenPath } from '../snapshot/current-snapshot';

/** The selected module's full figures: being fetched, fetched, or not to be had. */
export type ModuleDetailsState =
  | { kind: 'loading' }
  | { kind: 'failed'; message: string }
  | { kind: 'loaded'; module: ModuleRecord };

/**
 * The side panel of the selected module: what the map knows at once (P, ΣV, Σ decisions, rank),
 * then the rest of its figures and the reasons for its gravity once fetched; heaviest links.
 */
@Component({
  selector: 'sl-module-details',
  imports: [DecimalPipe, MatButtonModule, MatIconModule, MatProgressSpinnerModule, RouterLink],
  templateUrl: './module-details.html',
  styleUrl: './module-details.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModuleDetails {
  /** The module shown, as the map knows it. */
  readonly module = input.required<ModuleNode>();
  /** Its full figures. */
  readonly details = input.required<ModuleDetailsState>();
  /** The snapshot it belongs to (for the link to its functions). */
  readonly snapshotId = input.required<string>();
  /** Its cluster's colour on the map. */
  readonly colour = input.required<string>();
  /** The heaviest links into the module. */
  readonly incoming = input<readonly ModuleLink[]>([]);
  /** The heaviest links out of the module. */
  readonly outgoing = input<readonly ModuleLink[]>([]);
  /** A linked module was chosen. */
  readonly chosen = output<string>();
  /** The panel's close button was pressed. */
  readonly closed = output<void>();

  protected readonly labelOf = moduleLabel;

  /** The fetched figures, when they are this module's (a new selection may still be on its way). */
  protected readonly full = computed(() => {
    const details = this.details();
    return details.kind === 'loaded' && details.module.id === this.module().id ? details.module : null;
  });
  protected readonly failure = computed(() => {
    const details = this.details();
    return details.kind === 'failed' ? details.message : null;
  });

  /** The Functions screen's route. */
  protected functionsLink(): string {
    return snapshotScreenPath(this.snapshotId(), 'functions');
  }
}
