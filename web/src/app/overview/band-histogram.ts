import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { BAND_RANGES, BANDS, type Band, type BandCounts } from './snapshot-figures-api';

/** One bar of the histogram. */
interface HistogramBar {
  band: Band;
  range: string;
  count: number;
  /** Share of all functions, 0–1. */
  share: number;
  /** Bar height relative to the largest band, in percent (at least a sliver when count > 0). */
  length: number;
}

/**
 * V(G) across a snapshot's functions by band: a bar per band with its count and share written on
 * it, and the same figures as a table for screen readers (the drawing is hidden from them).
 */
@Component({
  selector: 'sl-band-histogram',
  imports: [DecimalPipe, PercentPipe],
  templateUrl: './band-histogram.html',
  styleUrl: './band-histogram.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BandHistogram {
  /** Functions per band. */
  readonly counts = input.required<BandCounts>();
  /** What the histogram is about, for its caption (e.g. the codebase's name). */
  readonly caption = input('V(G) across functions by band');

  /** All functions counted. */
  protected readonly total = computed(() => BANDS.reduce((sum, band) => sum + this.counts()[band], 0));
  /** The four bars, calm to knotted. */
  protected readonly bars = computed((): HistogramBar[] => {
    const counts = this.counts();
    const largest = Math.max(1, ...BANDS.map((band) => counts[band]));
    const total = this.total();
    return BANDS.map((band) => ({
      band,
      range: BAND_RANGES[band],
      count: counts[band],
      share: total > 0 ? counts[band] / total : 0,
      length: counts[band] > 0 ? Math.max(2, (100 * counts[band]) / largest) : 0,
    }));
  });
}
