import * as fs from 'node:fs';
import * as path from 'node:path';
import { analyzeSource } from '../analyzeSource';
import { DEFAULT_SETTINGS } from '../model';
import { METRIC_CATALOG } from './metricCatalog';

const DOCS = path.resolve(__dirname, '../../../docs/metrics');

describe('metric documentation', () => {
  it.each(METRIC_CATALOG.map((m) => [m.id, m]))('should have a page for %s with a worked example', (id, metric) => {
    const page = path.join(DOCS, `${id}.md`);
    expect(fs.existsSync(page)).toBe(true);
    const text = fs.readFileSync(page, 'utf8');
    expect(text.split('\n')[0]).toBe(`# ${metric.title}`);
    expect(text).toMatch(/^## Worked example$/m);
  });

  it('should document every numeric field a function record carries', () => {
    const [, fn] = analyzeSource('a.ts', 'function f(a) { if (a) { return 1; } return 2; }', DEFAULT_SETTINGS).functions;
    const numeric = Object.entries(fn).filter(([k, v]) => typeof v === 'number' && k !== 'line' && k !== 'endLine' && !/Calls$/.test(k)).map(([k]) => k);
    const documented = new Set(METRIC_CATALOG.flatMap((m) => m.fields));
    expect(numeric.filter((k) => !documented.has(k))).toEqual([]);
  });

  it('should have no page without a metric', () => {
    const ids = new Set(METRIC_CATALOG.map((m) => m.id));
    const pages = fs.readdirSync(DOCS).filter((f) => f.endsWith('.md') && f !== 'README.md');
    expect(pages.filter((p) => !ids.has(p.replace(/\.md$/, '')))).toEqual([]);
  });
});
