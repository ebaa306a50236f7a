import { createHash } from 'node:crypto';

/**
 * A function's id: stable across snapshots while the code does not move. Derived from the file,
 * the stable qualified name (anonymous parts without line numbers) and the ordinal among
 * units with the same stable name in that file.
 */
export function unitId(file: string, stableName: string, ordinal: number): string {
  return createHash('sha256').update(`${file}\0${stableName}\0${ordinal}`).digest('base64url').slice(0, 16);
}
