import { Injectable } from '@angular/core';

/** Prefix of the localStorage keys holding ticked basis paths. */
const KEY_PREFIX = 'seamline.flow.tested';

/**
 * Which basis paths a person has ticked as tested, kept in this browser's localStorage per
 * snapshot and function (a personal checklist; nothing is sent to the server).
 */
@Injectable({ providedIn: 'root' })
export class PathChecklist {
  /** The ticked path indexes of one function. */
  load(snapshotId: string, functionId: string): Set<number> {
    try {
      const stored: unknown = JSON.parse(localStorage.getItem(keyOf(snapshotId, functionId)) ?? '[]');
      return new Set(Array.isArray(stored) ? stored.filter((n): n is number => Number.isInteger(n)) : []);
    } catch {
      // Storage can be switched off (SecurityError) or hold text that is not JSON: start empty.
      return new Set();
    }
  }

  /** Stores the ticked path indexes of one function (none: the entry is removed). */
  save(snapshotId: string, functionId: string, ticked: ReadonlySet<number>): void {
    try {
      const key = keyOf(snapshotId, functionId);
      if (ticked.size === 0) localStorage.removeItem(key);
      else localStorage.setItem(key, JSON.stringify([...ticked].sort((a, b) => a - b)));
    } catch {
      // Storage switched off or full (SecurityError, QuotaExceededError): the ticks last for this visit only.
    }
  }
}

function keyOf(snapshotId: string, functionId: string): string {
  return `${KEY_PREFIX}.${snapshotId}.${functionId}`;
}
