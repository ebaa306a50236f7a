import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import type { ModuleLink } from './atlas-graph';
import { moduleLabel, type ModuleRecord } from './module-graph';
import { snapshotScreenPath } from '../snapshot/current-snapshot';

/** The side panel of the selected module: its figures, gravity with reasons, heaviest links. */
@Component({
  selector: 'sl-module-details',
  imports: [DecimalPipe, MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './module-details.html',
  styleUrl: './module-details.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ModuleDetails {
  /** The module shown. */
  readonly module = input.required<ModuleRecord>();
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

  /** The Functions screen's route. */
  protected functionsLink(): string {
    return snapshotScreenPath(this.snapshotId(), 'functions');
  }
}
