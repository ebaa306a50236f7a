import * as os from 'node:os';

/**
 * Runs this process's work at a lower CPU priority (a `nice` value, 0–19): analyses are batch
 * work, and on a machine the API shares, readers should not queue behind them. An analysis then
 * takes the CPU the API leaves; alone on a machine it runs as fast as before. Set before any
 * thread starts, since Linux keeps the value per thread and new threads inherit it.
 * Returns the priority in effect.
 */
export function lowerPriority(nice: number): number {
  if (nice > os.getPriority()) os.setPriority(nice);
  return os.getPriority();
}
