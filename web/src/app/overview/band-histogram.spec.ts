import { TestBed } from '@angular/core/testing';

import { BandHistogram } from './band-histogram';
import type { BandCounts } from './snapshot-figures-api';

describe('BandHistogram', () => {
  async function render(counts: BandCounts): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(BandHistogram);
    fixture.componentRef.setInput('counts', counts);
    fixture.componentRef.setInput('caption', 'Functions by V(G) band in dispatch-monolith');
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  function tableRows(host: HTMLElement): string[][] {
    return Array.from(host.querySelectorAll('table tbody tr')).map((row) =>
      Array.from(row.querySelectorAll('th, td')).map((cell) => cell.textContent?.trim() ?? ''),
    );
  }

  function columns(host: HTMLElement): string[] {
    return Array.from(host.querySelectorAll('.chart .column')).map((column) =>
      Array.from(column.children)
        .map((part) => part.textContent?.trim())
        .filter(Boolean)
        .join(' '),
    );
  }

  function barHeights(host: HTMLElement): string[] {
    return Array.from(host.querySelectorAll<HTMLElement>('.bar')).map((bar) => bar.style.height);
  }

  it('should give screen readers a table of each band with its range, count and share', async () => {
    const host = await render({ calm: 603, busy: 12, tangled: 3, knotted: 0 });

    expect(host.querySelector('table caption')?.textContent?.trim()).toBe('Functions by V(G) band in dispatch-monolith');
    expect(tableRows(host)).toEqual([
      ['calm', '1–10', '603', '97.6%'],
      ['busy', '11–20', '12', '1.9%'],
      ['tangled', '21–50', '3', '0.5%'],
      ['knotted', 'above 50', '0', '0%'],
    ]);
    expect(host.querySelectorAll('tbody th[scope="row"]')).toHaveLength(4);
    // The drawing repeats the table, so it is hidden from assistive technology.
    expect(host.querySelector('.chart')?.getAttribute('aria-hidden')).toBe('true');
  });

  it('should write the count, share, band and range on each bar, in band order with its own colour class', async () => {
    const host = await render({ calm: 603, busy: 12, tangled: 3, knotted: 0 });

    expect(columns(host)).toEqual([
      '603 97.6% calm 1–10',
      '12 1.9% busy 11–20',
      '3 0.5% tangled 21–50',
      '0 0% knotted above 50',
    ]);
    const bandClasses = Array.from(host.querySelectorAll('.chart .column')).map((column) =>
      Array.from(column.classList).filter((name) => name.startsWith('band-')),
    );
    expect(bandClasses).toEqual([['band-calm'], ['band-busy'], ['band-tangled'], ['band-knotted']]);
  });

  it('should scale the bars to the largest band, keeping a sliver for small counts and none for zero', async () => {
    const host = await render({ calm: 200, busy: 100, tangled: 1, knotted: 0 });

    expect(barHeights(host)).toEqual(['100%', '50%', '2%', '0%']);
  });

  it('should show zero shares, not fail, for a snapshot without functions', async () => {
    const host = await render({ calm: 0, busy: 0, tangled: 0, knotted: 0 });

    expect(tableRows(host).map((row) => row[3])).toEqual(['0%', '0%', '0%', '0%']);
    expect(barHeights(host)).toEqual(['0%', '0%', '0%', '0%']);
  });
});
