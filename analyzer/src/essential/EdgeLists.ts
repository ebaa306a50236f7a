/**
 * Edge lists for graph rewriting
 * ==============================
 * A multigraph's edges kept in two intrusive doubly linked lists per node (edges leaving it,
 * edges entering it) over typed arrays, so that adding, removing and re-targeting an edge,
 * and reading a node's degrees, all take constant time and rewriting a large graph makes no
 * garbage. Edges keep the index they were created with. Walk a list with
 * `for (let i = lists.outHead[b]; i >= 0; i = lists.outNext[i])`.
 *
 * [Reference]: D. E. Knuth, The Art of Computer Programming vol. 1, §2.2.5 (doubly linked lists).
 */
export class EdgeLists {
  readonly from: Int32Array;
  readonly to: Int32Array;
  readonly outHead: Int32Array;
  readonly outNext: Int32Array;
  readonly outCount: Int32Array;
  readonly inHead: Int32Array;
  readonly inNext: Int32Array;
  readonly inCount: Int32Array;
  private readonly outPrev: Int32Array;
  private readonly inPrev: Int32Array;

  constructor(nodes: number, edges: number) {
    this.from = new Int32Array(edges);
    this.to = new Int32Array(edges);
    this.outHead = new Int32Array(nodes).fill(-1);
    this.outNext = new Int32Array(edges);
    this.outPrev = new Int32Array(edges);
    this.outCount = new Int32Array(nodes);
    this.inHead = new Int32Array(nodes).fill(-1);
    this.inNext = new Int32Array(edges);
    this.inPrev = new Int32Array(edges);
    this.inCount = new Int32Array(nodes);
  }

  /** Adds edge i from `from` to `to` (each index once). */
  add(i: number, from: number, to: number): void {
    this.from[i] = from;
    this.to[i] = to;
    this.linkOut(i);
    this.linkIn(i);
  }

  remove(i: number): void {
    this.unlinkOut(i);
    this.unlinkIn(i);
  }

  /** Points edge i at another node. */
  retarget(i: number, to: number): void {
    this.unlinkIn(i);
    this.to[i] = to;
    this.linkIn(i);
  }

  /** Moves every edge leaving `source` so that it leaves `target`, which must have none. */
  moveOut(source: number, target: number): void {
    for (let i = this.outHead[source]; i >= 0; i = this.outNext[i]) this.from[i] = target;
    this.outHead[target] = this.outHead[source];
    this.outCount[target] = this.outCount[source];
    this.outHead[source] = -1;
    this.outCount[source] = 0;
  }

  private linkOut(i: number): void {
    const b = this.from[i];
    this.outPrev[i] = -1;
    this.outNext[i] = this.outHead[b];
    if (this.outHead[b] >= 0) this.outPrev[this.outHead[b]] = i;
    this.outHead[b] = i;
    this.outCount[b]++;
  }

  private unlinkOut(i: number): void {
    const b = this.from[i];
    if (this.outPrev[i] >= 0) this.outNext[this.outPrev[i]] = this.outNext[i];
    else this.outHead[b] = this.outNext[i];
    if (this.outNext[i] >= 0) this.outPrev[this.outNext[i]] = this.outPrev[i];
    this.outCount[b]--;
  }

  private linkIn(i: number): void {
    const b = this.to[i];
    this.inPrev[i] = -1;
    this.inNext[i] = this.inHead[b];
    if (this.inHead[b] >= 0) this.inPrev[this.inHead[b]] = i;
    this.inHead[b] = i;
    this.inCount[b]++;
  }

  private unlinkIn(i: number): void {
    const b = this.to[i];
    if (this.inPrev[i] >= 0) this.inNext[this.inPrev[i]] = this.inNext[i];
    else this.inHead[b] = this.inNext[i];
    if (this.inNext[i] >= 0) this.inPrev[this.inNext[i]] = this.inPrev[i];
    this.inCount[b]--;
  }
}
