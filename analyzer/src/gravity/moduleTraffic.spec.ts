import { moduleEdge } from '../clusters/fixtures/moduleMaps';
import { GravityInputError } from './GravityInputError';
import { moduleTraffic } from './moduleTraffic';

// Clusters: X = {a, b}, Y = {c}, Z = {d}; e has no cluster (a cluster of its own), f has no edges.
const ids = ['a', 'b', 'c', 'd', 'e', 'f'].map((p) => `file:${p}`);
const assignment = new Map([['file:a', 'X'], ['file:b', 'X'], ['file:c', 'Y'], ['file:d', 'Z']]);
const edges = [
  moduleEdge('b', 'a', 3), moduleEdge('b', 'a', 1), moduleEdge('c', 'a', 2), moduleEdge('e', 'a', 1),
  moduleEdge('a', 'c', 2), moduleEdge('a', 'd', 1), moduleEdge('a', 'a', 7), moduleEdge('d', 'c', 0),
];

describe('moduleTraffic', () => {
  const t = moduleTraffic(ids, edges, assignment, 'file');

  it('should count distinct callers and callees, and the other clusters they sit in', () => {
    // a is called by b (twice), c and e; it calls c and d; its own self-loop and the zero edge count for nothing.
    expect([t.callers[0], t.callees[0], t.callerClusters[0], t.calleeClusters[0]]).toEqual([3, 2, 2, 2]);
    // Spread: Y (both ways), Z, e's own cluster → 3 other clusters.
    expect(t.spread[0]).toBe(3);
    expect([t.callers[2], t.callees[2], t.spread[2]]).toEqual([1, 1, 1]);
  });

  it('should give each module the share of its weight that stays in its cluster, 1 without edges', () => {
    // a: in 3 + 1 (b, inside) + 2 (c) + 1 (e), out 2 (c) + 1 (d) = 10, inside 4.
    expect([t.weight[0], t.ownWeight[0], t.cohesion[0]]).toEqual([10, 4, 0.4]);
    expect(t.cohesion[1]).toBe(1);
    expect([t.weight[5], t.cohesion[5]]).toEqual([0, 1]);
  });

  it('should count the clusters that take part in calls', () => {
    // X, Y, Z and e's own; f's own cluster has no edges.
    expect(t.activeClusters).toBe(4);
  });

  it('should refuse edges to unknown modules and negative weights', () => {
    expect(() => moduleTraffic(ids, [moduleEdge('a', 'zz')], assignment, 'file')).toThrow(/analyzer\/gravity: edge file:a → file:zz/);
    expect(() => moduleTraffic(ids, [moduleEdge('a', 'b', -1)], assignment, 'file')).toThrow(GravityInputError);
  });
});
