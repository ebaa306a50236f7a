import { hash } from 'node:crypto';

/**
 * A function's id: stable across snapshots while the code does not move. Derived from the file,
 * the stable qualified name (anonymous parts without line numbers) and the ordinal among
 * units with the same stable name in that file. (The one-shot `hash` gives the same digest as
 * `createHash`, at half the cost for inputs this short.)
 */
export function unitId(file: string, stableName: string, ordinal: number): string {
  return hash('sha256', `${file}\0${stableName}\0${ordinal}`, 'base64url').slice(0, 16);
}
