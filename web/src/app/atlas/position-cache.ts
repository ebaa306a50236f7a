import { InjectionToken } from '@angular/core';

import type { AtlasGraph } from './atlas-graph';
import type { ModuleLevel } from './module-graph';

/** Laid-out positions of one map: node ids and their x, y pairs (2 floats per id). */
export interface SavedPositions {
  ids: string[];
  xy: Float32Array;
}

/** Where laid-out positions are kept between visits. */
export interface PositionStore {
  /** The positions saved under `key`, or null. */
  get(key: string): Promise<SavedPositions | null>;
  /** Saves positions under `key`, replacing earlier ones. */
  put(key: string, positions: SavedPositions): Promise<void>;
}

/** The key of one snapshot's map at one level (snapshots never change, so neither do their maps). */
export function positionKey(snapshotId: string, level: ModuleLevel): string {
  return `${snapshotId}:${level}`;
}

/** The graph's current positions, compactly. */
export function capturePositions(graph: AtlasGraph): SavedPositions {
  const ids: string[] = new Array<string>(graph.order);
  const xy = new Float32Array(graph.order * 2);
  let i = 0;
  graph.forEachNode((id, attributes) => {
    ids[i] = id;
    xy[2 * i] = attributes.x;
    xy[2 * i + 1] = attributes.y;
    i += 1;
  });
  return { ids, xy };
}

/**
 * Moves the graph's nodes to saved positions. Returns whether every node had one (then the map
 * needs no layout); nodes without a saved position keep theirs.
 */
export function applyPositions(graph: AtlasGraph, saved: SavedPositions): boolean {
  if (saved.xy.length !== saved.ids.length * 2) return false;
  let placed = 0;
  saved.ids.forEach((id, i) => {
    if (!graph.hasNode(id)) return;
    const x = saved.xy[2 * i];
    const y = saved.xy[2 * i + 1];
    if (!Number.isFinite(x) || !Number.isFinite(y)) return;
    graph.mergeNodeAttributes(id, { x, y });
    placed += 1;
  });
  return placed === graph.order;
}

/** Keeps positions for this page's lifetime only (tests, and browsers without IndexedDB). */
export class MemoryPositionStore implements PositionStore {
  private readonly saved = new Map<string, SavedPositions>();

  get(key: string): Promise<SavedPositions | null> {
    return Promise.resolve(this.saved.get(key) ?? null);
  }

  put(key: string, positions: SavedPositions): Promise<void> {
    this.saved.set(key, positions);
    return Promise.resolve();
  }
}

/** The IndexedDB database and object store that keep positions. */
const DB_NAME = 'seamline-atlas';
const STORE = 'positions';
/** The key of the list of saved keys, most recent first. */
const RECENT_KEY = '#recent';
/** How many maps are kept; older ones are dropped (a 20,000-module map takes about 1 MB). */
export const KEPT_MAPS = 24;

/** Keeps positions in IndexedDB (large maps do not fit localStorage), the last `KEPT_MAPS` maps. */
export class IndexedDbPositionStore implements PositionStore {
  private db: Promise<IDBDatabase> | null = null;

  constructor(private readonly factory: IDBFactory) {}

  async get(key: string): Promise<SavedPositions | null> {
    const db = await this.open();
    const value = await request<unknown>(db.transaction(STORE, 'readonly').objectStore(STORE).get(key));
    return isSavedPositions(value) ? value : null;
  }

  async put(key: string, positions: SavedPositions): Promise<void> {
    const db = await this.open();
    const tx = db.transaction(STORE, 'readwrite');
    const store = tx.objectStore(STORE);
    const recent = await request<unknown>(store.get(RECENT_KEY));
    const keys = [key, ...(Array.isArray(recent) ? recent.filter((k): k is string => typeof k === 'string' && k !== key) : [])];
    for (const dropped of keys.splice(KEPT_MAPS)) store.delete(dropped);
    store.put(positions, key);
    store.put(keys, RECENT_KEY);
    await new Promise<void>((resolve, reject) => {
      tx.oncomplete = () => resolve();
      tx.onerror = () => reject(tx.error);
      tx.onabort = () => reject(tx.error);
    });
  }

  private open(): Promise<IDBDatabase> {
    this.db ??= new Promise((resolve, reject) => {
      const opening = this.factory.open(DB_NAME, 1);
      opening.onupgradeneeded = () => opening.result.createObjectStore(STORE);
      opening.onsuccess = () => resolve(opening.result);
      opening.onerror = () => reject(opening.error);
    });
    return this.db;
  }
}

function request<T>(req: IDBRequest): Promise<T> {
  return new Promise((resolve, reject) => {
    req.onsuccess = () => resolve(req.result as T);
    req.onerror = () => reject(req.error);
  });
}

function isSavedPositions(value: unknown): value is SavedPositions {
  const v = value as Partial<SavedPositions> | null | undefined;
  return !!v && Array.isArray(v.ids) && v.xy instanceof Float32Array;
}

/** Where the Atlas keeps positions: IndexedDB when the browser has it, else memory. */
export const POSITION_STORE = new InjectionToken<PositionStore>('Atlas position store', {
  providedIn: 'root',
  factory: () =>
    typeof indexedDB === 'undefined' ? new MemoryPositionStore() : new IndexedDbPositionStore(indexedDB),
});
