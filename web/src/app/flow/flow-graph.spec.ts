import { ComponentFixture, TestBed } from '@angular/core/testing';

import { FlowGraph } from './flow-graph';
import { loadVanGraph, loadVanPaths } from './flow-fixtures';
import { layoutFlowGraph } from './flow-layout';
import { pathHighlight } from './path-highlight';

describe('FlowGraph', () => {
  let fixture: ComponentFixture<FlowGraph>;
  const layout = layoutFlowGraph(loadVanGraph());

  beforeEach(async () => {
    fixture = TestBed.createComponent(FlowGraph);
    fixture.componentRef.setInput('layout', layout);
    await fixture.whenStable();
  });

  function page(): HTMLElement {
    return fixture.nativeElement as HTMLElement;
  }

  function svgWidth(): number {
    return Number(page().querySelector('svg.graph')?.getAttribute('width'));
  }

  function button(name: string): HTMLButtonElement {
    const found = Array.from(page().querySelectorAll('button')).find(
      (b) => b.getAttribute('aria-label') === name || b.textContent?.trim() === name,
    );
    if (!found) throw new Error(`no button ${name}`);
    return found;
  }

  it('should draw the graph at 100 % with the layout as its view box', () => {
    expect(svgWidth()).toBe(layout.width);
    expect(page().querySelector('svg.graph')?.getAttribute('viewBox')).toBe(`0 0 ${layout.width} ${layout.height}`);
    expect(page().querySelector('.zoom')?.textContent).toBe('100%');
  });

  it('should zoom with the buttons and with + and −, within limits', async () => {
    button('Zoom out').click();
    await fixture.whenStable();
    expect(page().querySelector('.zoom')?.textContent).toBe('80%');
    expect(svgWidth()).toBe(Math.round(layout.width * 0.8));

    page().dispatchEvent(new KeyboardEvent('keydown', { key: '+' }));
    await fixture.whenStable();
    expect(page().querySelector('.zoom')?.textContent).toBe('100%');

    for (let i = 0; i < 10; i++) button('Zoom in').click();
    await fixture.whenStable();
    expect(page().querySelector('.zoom')?.textContent).toBe('200%');

    button('100%').click();
    await fixture.whenStable();
    expect(svgWidth()).toBe(layout.width);
  });

  it('should report a block chosen by click or by Enter', async () => {
    const chosen: number[] = [];
    fixture.componentInstance.blockChosen.subscribe((id) => chosen.push(id));

    page().querySelector<SVGGElement>('g[data-block="3"]')?.dispatchEvent(new MouseEvent('click', { bubbles: true }));
    page().querySelector('g[data-block="4"]')?.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));

    expect(chosen).toEqual([3, 4]);
  });

  it('should mark the selected path’s blocks and edges, and say so to screen readers', async () => {
    fixture.componentRef.setInput('highlight', pathHighlight(loadVanGraph(), loadVanPaths()[2]));
    await fixture.whenStable();

    expect(page().querySelectorAll('g.block.on-path')).toHaveLength(6);
    expect(page().querySelectorAll('path.edge.on-path')).toHaveLength(6);
    expect(page().querySelector('g[data-block="5"]')?.getAttribute('aria-label')).toBe('Code block, line 6, on the selected path');
    expect(page().querySelector('path[data-edge="5"]')?.getAttribute('marker-end')).toBe('url(#sl-flow-arrow-path)');
  });
});
