import { buildAtlasModel, seedPositions } from './atlas-graph';
import { demoModuleGraph } from './module-graph.fixtures';
import { applyPositions, capturePositions, MemoryPositionStore, positionKey } from './position-cache';

describe('position cache', () => {
  it('should put nodes back where they were', () => {
    const laidOut = buildAtlasModel(demoModuleGraph());
    seedPositions(laidOut);
    laidOut.graph.mergeNodeAttributes('folder:src/billing', { x: 123.5, y: -7.25 });
    const saved = capturePositions(laidOut.graph);

    const fresh = buildAtlasModel(demoModuleGraph());
    expect(applyPositions(fresh.graph, saved)).toBe(true);
    expect(fresh.graph.getNodeAttributes('folder:src/billing')).toMatchObject({ x: 123.5, y: -7.25 });
    fresh.graph.forEachNode((id, { x, y }) => {
      expect([x, y]).toEqual([Math.fround(laidOut.graph.getNodeAttribute(id, 'x')), Math.fround(laidOut.graph.getNodeAttribute(id, 'y'))]);
    });
  });

  it('should report positions that do not cover every node, and ignore unknown ids and broken data', () => {
    const model = buildAtlasModel(demoModuleGraph());
    const partial = { ids: ['folder:src/billing', 'folder:elsewhere'], xy: new Float32Array([1, 2, 3, 4]) };

    expect(applyPositions(model.graph, partial)).toBe(false);
    expect(model.graph.getNodeAttributes('folder:src/billing')).toMatchObject({ x: 1, y: 2 });
    expect(applyPositions(model.graph, { ids: ['folder:src/routing'], xy: new Float32Array(1) })).toBe(false);
    expect(applyPositions(model.graph, { ids: ['folder:src/routing'], xy: new Float32Array([NaN, 1]) })).toBe(false);
    expect(model.graph.getNodeAttribute('folder:src/routing', 'x')).toBe(0);
  });

  it('should keep one entry per snapshot and level', async () => {
    const store = new MemoryPositionStore();
    const saved = { ids: ['a'], xy: new Float32Array([1, 2]) };
    await store.put(positionKey('s-1', 'folder'), saved);

    await expect(store.get(positionKey('s-1', 'folder'))).resolves.toBe(saved);
    await expect(store.get(positionKey('s-1', 'file'))).resolves.toBeNull();
    expect(positionKey('s-1', 'file')).not.toBe(positionKey('s-2', 'file'));
  });
});
