import { ts } from 'ts-morph';
import { findUnits } from './findUnits';
import { unitNodes } from './fingerprint';

// Stands in for the decision count: nested functions' decisions never belong to the field.
const fieldHasDecision = (f: ts.PropertyDeclaration) => !!f.initializer && !ts.isArrowFunction(f.initializer) && /\?|&&|\|\|/.test(f.initializer.getText());

function units(code: string, hasDecision = fieldHasDecision) {
  const sf = ts.createSourceFile('sample.ts', code, ts.ScriptTarget.Latest, true);
  return findUnits(sf, hasDecision).map((u) => `${u.kind} ${u.qualifiedName}`);
}

describe('findUnits', () => {
  it('should list top-level code first, then every function-like unit in source order', () => {
    expect(
      units(`
        function dispatch(order) { return order; }
        const price = (o) => o.total;
        const legacy = function () {};
        export default function () {}
      `),
    ).toEqual(['top-level <top-level>', 'function dispatch', 'arrow price', 'function legacy', 'function default']);
  });

  it('should qualify class members by their class and tell their kinds apart', () => {
    expect(
      units(`
        class OrderService {
          @Inject() private readonly repo = make();
          private express = this.isExpress ? 'yes' : 'no';
          constructor(a) {}
          assignCourier(o) {}
          get total() { return 1; }
          set total(v) {}
          static { init(); }
          abstract check(): void;
          overload(a: string): void;
          overload(a: any) {}
        }
      `),
    ).toEqual([
      'top-level <top-level>',
      'field-initializer OrderService.express',
      'constructor OrderService.constructor',
      'method OrderService.assignCourier',
      'getter OrderService.total',
      'setter OrderService.total',
      'static-block OrderService.<static>',
      'method OrderService.overload',
    ]);
  });

  it('should name callbacks after where they stand and nest inner functions in their parents', () => {
    expect(
      units(`
        namespace Routing {
          export const table = {
            plan(stops) { return stops.map((s) => s.id); },
            score: function () {},
          };
        }
        router.get = () => 1;
      `),
    ).toEqual([
      'top-level <top-level>',
      'method Routing.table.plan',
      'arrow Routing.table.plan.<anonymous>@4',
      'function Routing.table.score',
      'arrow router.get',
    ]);
  });

  it('should keep line numbers out of the stable name of anonymous units', () => {
    const sf = ts.createSourceFile('a.ts', '\n\nitems.forEach((i) => i);', ts.ScriptTarget.Latest, true);
    const [, callback] = findUnits(sf, () => false);
    expect(callback.qualifiedName).toBe('<anonymous>@3');
    expect(callback.stableName).toBe('<anonymous>');
  });

  it('should take a field initializer as a unit only when it holds a decision', () => {
    expect(units('class K { a = 1; b = x || y; c = () => (x ? 1 : 2); }')).toEqual([
      'top-level <top-level>',
      'field-initializer K.b',
      'arrow K.c',
    ]);
  });

  it('should survive deeply nested code without overflowing the stack', () => {
    const depth = 400;
    const code = `${'if (a) {'.repeat(depth)}x();${'}'.repeat(depth)}`;
    expect(units(code)).toEqual(['top-level <top-level>']);
  });
});

describe('unit spans', () => {
  it('should start a decorated method at its first modifier, not at the decorator or comments', () => {
    const { unitSpan } = require('./unitSpan') as typeof import('./unitSpan');
    const sf = ts.createSourceFile('a.ts', 'class A {\n  /** doc */\n  @Get()\n  static\n  m() {\n  }\n}', ts.ScriptTarget.Latest, true);
    const method = (sf.statements[0] as ts.ClassDeclaration).members[0];
    expect(unitSpan(method, sf)).toMatchObject({ line: 4, endLine: 6 });
  });

  describe('the walk', () => {
    const code = `
      type Handler = (event: { kind: string }) => void;
      class Courier<T extends Base> implements Runner {
        private pick = (xs: number[]) => xs.filter((x) => x > 1) ?? [];
        static { init(); }
        get load(): number { return this.items.length || 0; }
        run(this: Courier<T>, [a, b]: [number, string] = [1, 'x']) { return { go() { return a; }, [b]: (c?: T) => c }; }
      }
      export const table = { rows: function () { return 1 as unknown as Handler; } };
    `;

    it('lists the nodes of each unit in pre-order, as fingerprints read them', () => {
      const sf = ts.createSourceFile('sample.ts', code, ts.ScriptTarget.Latest, true);
      const found = findUnits(sf, () => true);
      const isUnit = new Set(found.map((u) => u.node));
      expect(found.length).toBeGreaterThan(8);
      for (const unit of found) expect(unit.nodes).toEqual(unitNodes(unit.node, (n) => isUnit.has(n)));
    });

    it('links every node to its parent in a tree parsed without parents', () => {
      const sf = ts.createSourceFile('sample.ts', code, ts.ScriptTarget.Latest, false);
      const unlinked: ts.Node[] = [];
      const collect = (n: ts.Node) => ts.forEachChild(n, (c) => void (c.parent === undefined && unlinked.push(c), collect(c)));
      collect(sf);
      expect(unlinked.length).toBeGreaterThan(50);
      findUnits(sf, () => true);
      const wrong: string[] = [];
      const check = (n: ts.Node) =>
        ts.forEachChild(n, (c) => {
          if (c.parent !== n) wrong.push(ts.SyntaxKind[c.kind]);
          check(c);
        });
      check(sf);
      expect(wrong).toEqual([]);
    });
  });
});
