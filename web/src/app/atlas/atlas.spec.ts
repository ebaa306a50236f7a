import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorBody } from '../testing/api-fixtures';
import { Atlas } from './atlas';
import type { AtlasGraph } from './atlas-graph';
import { ATLAS_RENDERER, type AtlasRenderer, type AtlasRendererEvents } from './atlas-renderer';
import type { AtlasView } from './atlas-view';
import type { ModuleGraph } from './module-graph';
import { demoModuleGraph, demoModuleRecords, moduleNode, moduleRecord } from './module-graph.fixtures';
import { MemoryPositionStore, POSITION_STORE, positionKey } from './position-cache';

/** Stands in for sigma (jsdom has no WebGL): records what the screen asks of the map. */
class FakeRenderer implements AtlasRenderer {
  views: AtlasView[] = [];
  focused: string[] = [];
  layouts = 0;
  destroyed = false;
  private finishLayout: (() => void) | null = null;

  constructor(
    readonly graph: AtlasGraph,
    readonly events: AtlasRendererEvents,
  ) {}

  setView(view: AtlasView): void {
    this.views.push(view);
  }
  focusNode(id: string): void {
    this.focused.push(id);
  }
  runLayout(): Promise<void> {
    this.layouts += 1;
    // The "layout" moves one node, so saved positions can be told from seeded ones.
    this.graph.forEachNode((id) => this.graph.setNodeAttribute(id, 'x', 42));
    return new Promise((resolve) => (this.finishLayout = resolve));
  }
  settle(): void {
    this.finishLayout?.();
  }
  stopLayout(): void {
    this.settle();
  }
  exportPng(): Promise<Blob> {
    return Promise.resolve(new Blob(['png'], { type: 'image/png' }));
  }
  destroy(): void {
    this.destroyed = true;
  }
  lastView(): AtlasView {
    return this.views[this.views.length - 1];
  }
}

describe('Atlas', () => {
  let http: HttpTestingController;
  let harness: RouterTestingHarness;
  let renderers: FakeRenderer[];
  let store: MemoryPositionStore;

  beforeAll(() => {
    // jsdom does not scroll; the module list scrolls its viewport to the selected row.
    Element.prototype.scrollTo ??= function scrollTo() {};
  });

  beforeEach(async () => {
    renderers = [];
    store = new MemoryPositionStore();
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter(
          [
            { path: 'snapshots/:snapshotId/atlas', component: Atlas },
            { path: 'snapshots/:snapshotId/functions', children: [] },
          ],
          withComponentInputBinding(),
        ),
        {
          provide: ATLAS_RENDERER,
          useValue: (_host: HTMLElement, graph: AtlasGraph, events: AtlasRendererEvents) => {
            const renderer = new FakeRenderer(graph, events);
            renderers.push(renderer);
            return Promise.resolve(renderer);
          },
        },
        { provide: POSITION_STORE, useValue: store },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => http.verify());

  function page(): HTMLElement {
    return harness.routeNativeElement as HTMLElement;
  }

  async function open(url: string, graph: ModuleGraph | null = demoModuleGraph(), level = 'folder'): Promise<void> {
    await harness.navigateByUrl(url);
    if (graph) await answer(graph, level);
  }

  async function answer(graph: ModuleGraph, level = 'folder'): Promise<void> {
    http.expectOne({ method: 'GET', url: `/api/snapshots/s-1/module-graph?level=${level}` }).flush(graph);
    await settle();
  }

  async function settle(): Promise<void> {
    for (let i = 0; i < 4; i++) {
      await harness.fixture.whenStable();
      await new Promise((resolve) => setTimeout(resolve, 0));
    }
  }

  /** Answers the side panel's request for one module's full figures. */
  async function answerModule(id: string): Promise<void> {
    const module = demoModuleRecords().find((m) => m.id === id);
    http.expectOne({ method: 'GET', url: `/api/snapshots/s-1/modules/${encodeURIComponent(id)}` }).flush({ module });
    await settle();
  }

  function listRows(): string[] {
    return Array.from(page().querySelectorAll('[role="option"] .name')).map((el) => el.textContent?.trim() ?? '');
  }

  it('should load the folder level by default, draw the map, lay it out once and keep the positions', async () => {
    await harness.navigateByUrl('/snapshots/s-1/atlas');
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    await answer(demoModuleGraph());

    expect(renderers).toHaveLength(1);
    const [renderer] = renderers;
    expect(renderer.graph.order).toBe(4);
    expect(renderer.layouts).toBe(1);
    expect(page().querySelector('.status')?.textContent).toContain('4 of 4 modules, 3 of 3 links.');
    expect(page().querySelector('.status')?.textContent).toContain('Arranging the map');
    // A map this small draws its links while it moves.
    expect(page().querySelector('.status')?.textContent).not.toContain('Links are drawn once it settles');

    renderer.settle();
    await settle();
    expect(page().querySelector('.status')?.textContent).toContain('kept for your next visit');
    const saved = await store.get(positionKey('s-1', 'folder'));
    expect(saved?.ids).toHaveLength(4);
    expect(saved?.xy[0]).toBe(42);

    // The legend lists each cluster with its colour, members and ΣV.
    const legend = Array.from(page().querySelectorAll('.legend li')).map((li) =>
      Array.from(li.children).map((part) => part.textContent?.trim()),
    );
    expect(legend).toEqual([
      ['', 'Cluster c1', '2 · ΣV 500'],
      ['', 'Cluster c2', '1 · ΣV 100'],
      ['', 'No cluster', '1 · ΣV 4'],
    ]);
    const dots = Array.from(page().querySelectorAll<HTMLElement>('.legend .dot')).map((dot) => dot.style.background);
    expect(new Set(dots).size).toBe(3);
  });

  it('should say that a large map draws its links once its layout settles', async () => {
    const nodes = Array.from({ length: 1_600 }, (_, i) => moduleNode(moduleRecord(`src/area${i}`, { cyclomatic: 1 + (i % 9) })));
    const links = Array.from({ length: 1_500 }, (_, i): [number, number, number] => [i, i + 1, 1]);
    await open('/snapshots/s-1/atlas', { level: 'folder', nodes, links, clusters: [] });

    expect(renderers[0].layouts).toBe(1);
    expect(page().querySelector('.status')?.textContent?.replace(/\s+/g, ' ')).toContain('Arranging the map… Links are drawn once it settles.');
    renderers[0].settle();
    await settle();
    expect(page().querySelector('.status')?.textContent).not.toContain('Links are drawn');
  });

  it('should reuse saved positions without laying the map out again', async () => {
    await store.put(positionKey('s-1', 'folder'), {
      ids: demoModuleGraph().nodes.map((n) => n.id),
      xy: new Float32Array([1, 1, 2, 2, 3, 3, 4, 4]),
    });
    await open('/snapshots/s-1/atlas?level=folder');

    expect(renderers[0].layouts).toBe(0);
    expect(renderers[0].graph.getNodeAttributes('folder:src/billing')).toMatchObject({ x: 3, y: 3 });
    expect(page().querySelector('.status')?.textContent).toContain('Same layout as your last visit.');
  });

  it('should select the module in ?focus=, dim the rest and show its figures and gravity', async () => {
    await open('/snapshots/s-1/atlas?level=folder&focus=folder:src/dispatch-core');

    const renderer = renderers[0];
    expect(renderer.focused).toEqual(['folder:src/dispatch-core']);
    expect(renderer.lastView().selected).toBe('folder:src/dispatch-core');
    expect([...renderer.lastView().neighbours].sort()).toEqual(['folder:src/billing', 'folder:src/routing']);
    const panel = page().querySelector('sl-module-details');
    expect(panel?.querySelector('h2')?.textContent?.trim()).toBe('src/dispatch-core');
    const figures = () =>
      Array.from(panel?.querySelectorAll('.figures > div') ?? []).map((d) =>
        [d.querySelector('dt'), d.querySelector('dd')].map((part) => part?.textContent?.replace(/\s+/g, ' ').trim()).join(': '),
      );
    // What the map knows shows at once; the rest once the module's own figures arrive.
    expect(figures()).toEqual(['P: 99', 'ΣV: 400', 'Σ decisions: 204', 'Gravity rank: #1']);
    expect(panel?.querySelector('[role="status"]')?.textContent).toContain('Loading');
    await answerModule('folder:src/dispatch-core');
    expect(figures()).toEqual([
      'P: 99',
      'ΣV: 400',
      'Σ decisions: 204',
      'Largest V(G): 41',
      'S0 / S1: 220 / 122',
      'Fan-in / fan-out: 33 / 120',
      'I: 0.47',
      'Gravity: 79.5 (#1)',
    ]);
    expect(panel?.textContent).toContain('called from 3 of 3 other clusters');
    const link = panel?.querySelector<HTMLAnchorElement>('a.functions');
    expect(link?.getAttribute('href')).toBe('/snapshots/s-1/functions?module=folder:src%2Fdispatch-core');
    // The list marks it too.
    expect(page().querySelector('[role="option"][aria-selected="true"] .name')?.textContent?.trim()).toBe('src/dispatch-core');
  });

  it('should say so in the panel when the module figures cannot be loaded, keeping what the map knows', async () => {
    await open('/snapshots/s-1/atlas?focus=folder:src/billing');
    http
      .expectOne(`/api/snapshots/s-1/modules/${encodeURIComponent('folder:src/billing')}`)
      .flush(errorBody('not_found', 'No such module in this snapshot.'), { status: 404, statusText: 'Not Found' });
    await settle();

    const panel = page().querySelector('sl-module-details');
    expect(panel?.querySelector('[role="alert"]')?.textContent).toContain('No such module in this snapshot.');
    expect(panel?.querySelector('.figures')?.textContent).toContain('ΣV');
  });

  it('should select a module clicked on the map and clear the selection on empty space', async () => {
    await open('/snapshots/s-1/atlas');

    renderers[0].events.nodeClicked('folder:src/billing');
    await settle();
    await answerModule('folder:src/billing');
    expect(TestBed.inject(Router).url).toBe('/snapshots/s-1/atlas?focus=folder:src%2Fbilling');
    expect(page().querySelector('sl-module-details h2')?.textContent?.trim()).toBe('src/billing');
    expect(renderers[0].lastView().selected).toBe('folder:src/billing');

    renderers[0].events.stageClicked();
    await settle();
    expect(page().querySelector('sl-module-details')).toBeNull();
    expect(renderers[0].lastView().selected).toBeNull();
  });

  it('should filter the list by the search text and select a suggestion, moving the camera to it', async () => {
    await open('/snapshots/s-1/atlas');
    const input = page().querySelector<HTMLInputElement>('input[type="search"]');
    input!.value = 'routing';
    input!.dispatchEvent(new Event('input'));
    await settle();

    expect(listRows()).toEqual(['src/routing']);
    input!.dispatchEvent(new Event('focusin'));
    await settle();
    const option = document.querySelector<HTMLElement>('mat-option');
    expect(option?.textContent).toContain('src/routing');
    option!.click();
    await settle();
    await answerModule('folder:src/routing');

    expect(renderers[0].focused).toContain('folder:src/routing');
    expect(renderers[0].lastView().selected).toBe('folder:src/routing');
    expect(listRows()).toHaveLength(4);
  });

  it('should hide small modules and light links through the view, without rebuilding the map', async () => {
    await open('/snapshots/s-1/atlas');
    const [cyclomatic, weight] = Array.from(page().querySelectorAll<HTMLInputElement>('.filters input'));
    cyclomatic.value = '50';
    cyclomatic.dispatchEvent(new Event('input'));
    weight.value = '11';
    weight.dispatchEvent(new Event('input'));
    await settle();

    expect(renderers).toHaveLength(1);
    expect(renderers[0].lastView()).toMatchObject({ minCyclomatic: 50, minWeight: 11 });
    expect(page().querySelector('.status')?.textContent).toContain('3 of 4 modules, 1 of 3 links.');
    expect(listRows()).not.toContain('src/shared');
  });

  it('should switch the level through the URL, drop the selection and draw the new map', async () => {
    await open('/snapshots/s-1/atlas?focus=folder:src/billing');
    await answerModule('folder:src/billing');
    const toggles = Array.from(page().querySelectorAll<HTMLButtonElement>('mat-button-toggle button'));
    expect(toggles.map((b) => b.textContent?.trim())).toEqual(['file', 'folder', 'package']);
    toggles[0].click();
    await settle();

    expect(TestBed.inject(Router).url).toBe('/snapshots/s-1/atlas?level=file');
    await answer({ ...demoModuleGraph(), level: 'file' }, 'file');
    expect(renderers[0].destroyed).toBe(true);
    expect(renderers).toHaveLength(2);
  });

  it('should say when a level has no modules', async () => {
    await open('/snapshots/s-1/atlas?level=package', { level: 'package', nodes: [], links: [], clusters: [] }, 'package');

    expect(page().querySelector('[role="status"]')?.textContent).toContain('no modules at the package level');
    expect(renderers).toHaveLength(0);
  });

  it('should show the error and load again on Retry', async () => {
    await open('/snapshots/s-1/atlas', null);
    http
      .expectOne('/api/snapshots/s-1/module-graph?level=folder')
      .flush(errorBody('not_ready', 'The snapshot is still being analysed.'), { status: 409, statusText: 'Conflict' });
    await settle();

    const alert = page().querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('The snapshot is still being analysed.');
    alert?.querySelector('button')?.click();
    await settle();
    await answer(demoModuleGraph());
    expect(page().querySelector('[role="alert"]')).toBeNull();
    expect(renderers).toHaveLength(1);
  });

  it('should export the current view as a PNG download', async () => {
    await open('/snapshots/s-1/atlas');
    const created: Blob[] = [];
    URL.createObjectURL = jest.fn((blob: Blob) => (created.push(blob), 'blob:atlas'));
    URL.revokeObjectURL = jest.fn();
    const clicks = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      expect(this.download).toBe('atlas-folder.png');
    });

    const button = Array.from(page().querySelectorAll('button')).find((b) => b.textContent?.includes('Export PNG'));
    button!.click();
    await settle();

    expect(clicks).toHaveBeenCalledTimes(1);
    expect(created[0].type).toBe('image/png');
    clicks.mockRestore();
  });
});
