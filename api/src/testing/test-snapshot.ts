import type { DataSource } from 'typeorm';
import { DEFAULT_SETTINGS, scanDirectory, type Snapshot as AnalyzedSnapshot } from '../analyzer-lib';
import { tempTree } from '../../../analyzer/src/testing/tempTree';
import { Codebase, Snapshot } from '../db/entities';

/** A small two-folder codebase with calls between folders and one function over the limit. */
export const SMALL_CODEBASE: Record<string, string> = {
  'tsconfig.json': JSON.stringify({ compilerOptions: { strict: true, target: 'es2022', module: 'commonjs' }, include: ['src'] }),
  'src/orders/order.ts': `import { price } from '../pricing/price';
export function total(items: number[], vip: boolean): number {
  let sum = 0;
  for (const i of items) sum += price(i, vip);
  return sum > 100 && vip ? sum * 0.9 : sum;
}
export function grade(n: number): string {
  if (n > 90) return 'a'; else if (n > 80) return 'b'; else if (n > 70) return 'c'; else if (n > 60) return 'd';
  else if (n > 50) return 'e'; else if (n > 40) return 'f'; else if (n > 30) return 'g'; else if (n > 20) return 'h';
  else if (n > 10) return 'i'; else if (n > 5) return 'j'; else if (n > 1) return 'k';
  return 'z';
}
`,
  'src/pricing/price.ts': `import { grade } from '../orders/order';
export function price(i: number, vip: boolean): number {
  return vip ? i * 0.95 : grade(i) === 'a' ? i * 2 : i;
}
`,
};

/** Scans SMALL_CODEBASE (or `files`) with calls: an analysed snapshot as a worker would store it. */
export async function analyseSmallCodebase(files: Record<string, string> = SMALL_CODEBASE): Promise<AnalyzedSnapshot> {
  return scanDirectory(tempTree(files), { settings: { ...DEFAULT_SETTINGS }, threads: 1 });
}

/** A codebase in the workspace with one queued snapshot row. */
export async function createQueuedSnapshot(dataSource: DataSource, workspaceId: string, name = `codebase-${Math.random().toString(36).slice(2, 8)}`) {
  const codebase = await dataSource.getRepository(Codebase).save({ workspaceId, name });
  const snapshot = await dataSource.getRepository(Snapshot).save({ codebaseId: codebase.id, status: 'queued' as const });
  return { codebase, snapshot };
}
