import { TestBed } from '@angular/core/testing';

import { BandHistogram } from './band-histogram';
import type { BandCounts } from './snapshot-figures-api';

describe('BandHistogram', () => {
  async function render(counts: BandCounts): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(BandHistogram);
    fixture.componentRef.setInput('counts', counts);
    fixture.componentRef.setInput('caption', 'V(G) by band in dispatch-monolith');
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function rows(host: HTMLElement): string[][] {
    return Array.from(host.querySelectorAll('tbody tr')).map((row) =>
      Array.from(row.querySelectorAll('th, td')).map((cell) => cell.textContent?.trim() ?? ''),
    );
  }

  function barWidths(host: HTMLElement): string[] {
    return Array.from(host.querySelectorAll<HTMLElement>('.bar')).map((bar) => bar.style.width);
  }

  it('should write out each band with its range, count and share', async () => {
    const host = await render({ calm: 603, busy: 12, tangled: 3, knotted: 0 });

    expect(host.querySelector('caption')?.textContent?.trim()).toBe('V(G) by band in dispatch-monolith');
    expect(rows(host)).toEqual([
      ['calm', '1–10', '603', '97.6%', ''],
      ['busy', '11–20', '12', '1.9%', ''],
      ['tangled', '21–50', '3', '0.5%', ''],
      ['knotted', 'above 50', '0', '0%', ''],
    ]);
    // Row headers name the band for screen readers; the bars themselves are hidden from them.
    expect(Array.from(host.querySelectorAll('tbody th[scope="row"]')).length).toBe(4);
    expect(Array.from(host.querySelectorAll('.band-bar')).every((cell) => cell.getAttribute('aria-hidden') === 'true')).toBe(true);
  });

  it('should scale the bars to the largest band, keeping a sliver for small counts and none for zero', async () => {
    const host = await render({ calm: 200, busy: 100, tangled: 1, knotted: 0 });

    expect(barWidths(host)).toEqual(['100%', '50%', '1%', '0%']);
    expect(Array.from(host.querySelectorAll('tbody tr')).map((row) => row.className)).toEqual([
      'band band-calm',
      'band band-busy',
      'band band-tangled',
      'band band-knotted',
    ]);
  });

  it('should show zero shares, not fail, for a snapshot without functions', async () => {
    const host = await render({ calm: 0, busy: 0, tangled: 0, knotted: 0 });

    expect(rows(host).map((row) => row[3])).toEqual(['0%', '0%', '0%', '0%']);
    expect(barWidths(host)).toEqual(['0%', '0%', '0%', '0%']);
  });
});
