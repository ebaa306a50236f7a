import { ts } from 'ts-morph';
import { countAbstractness } from './countAbstractness';

const count = (text: string) => countAbstractness(ts.createSourceFile('a.ts', text, ts.ScriptTarget.Latest, true));

describe('countAbstractness', () => {
  it('should count interfaces and abstract classes as abstract among all classes and interfaces', () => {
    const text = `
      export interface Priced { price(): number }
      export abstract class Shape { abstract area(): number }
      export class Square extends Shape { area() { return 1; } }
      const Anonymous = class {};
      function factory() { class Local {} interface Inner { x: number } return Local; }
      namespace N { export abstract class Deep {} }
      type Alias = { a: number };
      enum Colour { Red }`;
    // Martin 2002 (Stable Abstractions Principle): A counts interfaces and abstract classes.
    expect(count(text)).toEqual({ abstract: 4, total: 7 });
  });

  it('should find nothing in a file without classes or interfaces', () => {
    expect(count('export function f() { return { a: 1 }; }\ntype T = string;')).toEqual({ abstract: 0, total: 0 });
  });
});
