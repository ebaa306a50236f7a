import type { DataSource } from 'typeorm';
import { prepareCarve, type CarveIndex, type ModuleLevel, type Snapshot as AnalyzedSnapshot } from '../analyzer-lib';
import { loadSnapshot } from '../analysis/load-snapshot';

/** How many loaded snapshots the API keeps: carve editing and shift reuse the same few. */
const CAPACITY = 4;

interface Entry {
  snapshot: Promise<AnalyzedSnapshot>;
  carve: Map<ModuleLevel, CarveIndex>;
}

/**
 * Ready snapshots loaded without their graphs (what carve evaluation and shift read), kept in a
 * small least-recently-used cache. A ready snapshot's modules and calls never change; a coverage
 * import or a delete calls `forget`.
 */
export class SnapshotCache {
  private readonly entries = new Map<string, Entry>();

  constructor(private readonly dataSource: DataSource) {}

  async snapshot(id: string): Promise<AnalyzedSnapshot> {
    return this.entry(id).snapshot;
  }

  /** The carve index of one level, prepared once per snapshot and level. */
  async carveIndex(id: string, level: ModuleLevel): Promise<CarveIndex> {
    const entry = this.entry(id);
    let index = entry.carve.get(level);
    if (!index) {
      index = prepareCarve(await entry.snapshot, level);
      entry.carve.set(level, index);
    }
    return index;
  }

  forget(id: string): void {
    this.entries.delete(id);
  }

  private entry(id: string): Entry {
    let entry = this.entries.get(id);
    if (entry) {
      this.entries.delete(id);
    } else {
      entry = { snapshot: loadSnapshot(this.dataSource, id, { graphs: false }), carve: new Map() };
      entry.snapshot.catch(() => this.entries.delete(id));
    }
    this.entries.set(id, entry);
    while (this.entries.size > CAPACITY) this.entries.delete(this.entries.keys().next().value!);
    return entry;
  }
}
