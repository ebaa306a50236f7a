import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { countDecisions } from '../decisions/countDecisions';
import { cyclomaticOf } from '../metrics/cyclomatic';
import { DEFAULT_SETTINGS, ESLINT_COMPARABLE_SETTINGS } from '../model/CountingSettings';
import { buildFlowGraph } from './buildFlowGraph';
import { fromCompactGraph, toCompactGraph } from './compactGraph';
import { collectUnits } from './fixtures/collectUnits';
import { validateFlowGraph } from './validateFlowGraph';

// Real open-source code installed from the registry: the TypeScript sources rxjs ships.
const RXJS = join(__dirname, '../../../node_modules/rxjs/src/internal');
const files = [
  ...readdirSync(join(RXJS, 'operators')).map((f) => join('operators', f)),
  ...readdirSync(join(RXJS, 'observable')).filter((f) => f.endsWith('.ts')).map((f) => join('observable', f)),
  'Subscriber.ts',
  'Subscription.ts',
  'Subject.ts',
  'scheduler/AsyncAction.ts',
].filter((f) => f.endsWith('.ts'));

describe('flow graphs of real code (rxjs sources)', () => {
  it('should find enough code to be a meaningful check', () => {
    expect(files.length).toBeGreaterThan(100);
  });

  it.each([
    ['McCabe defaults', DEFAULT_SETTINGS],
    ['ESLint-comparable settings', ESLINT_COMPARABLE_SETTINGS],
  ])('should give every unit a sound graph with V(G) = decisions + 1 under %s', (_name, settings) => {
    let units = 0;
    let decisions = 0;
    const problems: string[] = [];
    for (const file of files) {
      const parsed = collectUnits(readFileSync(join(RXJS, file), 'utf8'), file);
      expect(parsed.syntaxErrors).toEqual([]);
      for (const unit of parsed.units) {
        const graph = buildFlowGraph(unit, parsed.sourceFile, settings);
        const count = countDecisions(unit, parsed.sourceFile, settings);
        const v = cyclomaticOf(graph);
        const where = `${file}:${parsed.sourceFile.getLineAndCharacterOfPosition(unit.getStart(parsed.sourceFile)).line + 1}`;
        for (const p of validateFlowGraph(graph)) problems.push(`${where}: ${p}`);
        if (v.components !== 1 || v.strict !== count.total + 1) problems.push(`${where}: V ${v.strict} (P ${v.components}) vs ${count.total} decisions`);
        if (JSON.stringify(fromCompactGraph(toCompactGraph(graph))) !== JSON.stringify(graph)) problems.push(`${where}: compact round trip differs`);
        units++;
        decisions += count.total;
      }
    }
    expect(problems).toEqual([]);
    expect(units).toBeGreaterThan(500);
    expect(decisions).toBeGreaterThan(200);
  });
});
