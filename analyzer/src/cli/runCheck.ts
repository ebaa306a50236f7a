/**
 * `seamline check`
 * ================
 * Reads a snapshot (and optionally a baseline), lists the functions over the limit (with a
 * baseline: only the new or worsened ones) as `file:line  qualifiedName  V(G)=N`, largest V(G)
 * first, and returns 1 when it listed any, 0 otherwise. Unreadable or invalid files and
 * baselines counted under other settings are thrown as typed errors (exit 2 in main).
 */
import path from 'node:path';
import { findBreaches } from '../check/findBreaches';
import type { Breach } from '../check/findBreaches';
import type { Snapshot } from '../model/Snapshot';
import { parseSnapshot } from '../snapshot/parseSnapshot';
import { SnapshotInputError } from '../snapshot/SnapshotInputError';
import { CliInputError } from './CliInputError';
import { countOf, formatCount } from './formatCount';
import type { CheckCommand } from './parseCommandLine';
import { readInputFile } from './readInputFile';
import type { CommandIo } from './runScan';

async function readSnapshotFile(file: string, cwd: string, label: string): Promise<Snapshot> {
  const text = await readInputFile(path.resolve(cwd, file), label, file);
  try {
    return parseSnapshot(text, file);
  } catch (error) {
    if (error instanceof SnapshotInputError) throw new CliInputError(error.reason);
    throw error;
  }
}

function note(breach: Breach): string {
  const moved = breach.movedFrom ? `, moved from ${breach.movedFrom}` : '';
  if (breach.reason === 'new') return `  (new${moved})`;
  if (breach.previousCyclomatic !== undefined) return `  (was ${breach.previousCyclomatic}${moved})`;
  return '';
}

/** One listed function: `src/a.ts:12  Orders.assign  V(G)=14  (was 9)`. */
export function breachLine(breach: Breach): string {
  const fn = breach.function;
  return `${fn.file}:${fn.line}  ${fn.qualifiedName}  V(G)=${fn.cyclomatic}${note(breach)}`;
}

/** Run `seamline check`; returns 1 when functions are listed, else 0. */
export async function runCheck(command: CheckCommand, io: CommandIo): Promise<number> {
  const snapshot = await readSnapshotFile(command.snapshot, io.cwd, 'snapshot');
  const baseline = command.baseline === undefined ? undefined : await readSnapshotFile(command.baseline, io.cwd, 'baseline');
  const limit = command.limit ?? snapshot.settings.limit;
  const { breaches, tolerated } = findBreaches(snapshot, { limit, baseline });
  const limitText = `the limit of ${formatCount(limit)} (rule of thumb, not a verdict)`;
  const lines = breaches.map(breachLine);
  if (baseline === undefined) {
    lines.push(
      breaches.length > 0
        ? `${countOf(breaches.length, 'function')} over ${limitText}`
        : `no function over ${limitText}; ${countOf(snapshot.functions.length, 'function')} checked`,
    );
  } else {
    const kept = tolerated > 0 ? `; ${formatCount(tolerated)} already over it in the baseline and not worse` : '';
    lines.push(
      breaches.length > 0
        ? `${countOf(breaches.length, 'function')} new or worse over ${limitText}${kept}`
        : `no function new or worse over ${limitText}${kept}`,
    );
  }
  io.stdout.write(`${lines.join('\n')}\n`);
  return breaches.length > 0 ? 1 : 0;
}
