/**
 * ESLint's per-function complexity, as a reference
 * ================================================
 * Runs the linter's built-in `complexity` rule (eslint 9.39.5, a general-purpose library that
 * does not share our code) with a maximum of 0, so that every function, class field initializer
 * and class static block is reported with its value, and returns each report with its position.
 * Test-only: the analyzer never depends on the linter.
 *
 * [Reference]: eslint lib/rules/complexity.js (reference-checks.md §8).
 */
import { Linter } from 'eslint';
import * as tsParser from '@typescript-eslint/parser';

export interface EslintUnit {
  /** 1-based lines and 0-based columns of the reported location (a function's head). */
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  origin: 'function' | 'class-field-initializer' | 'class-static-block';
  complexity: number;
}

const MESSAGE = /^(.*) has a complexity of (\d+)\. Maximum allowed is 0\.$/;

/** Every unit ESLint's complexity rule reports in `code`. */
export function eslintComplexity(code: string, file: string, variant: 'classic' | 'modified' = 'classic'): EslintUnit[] {
  const linter = new Linter({ configType: 'flat' });
  const messages = linter.verify(
    code,
    [
      {
        files: ['**/*.{ts,tsx,mts,cts,js,jsx,mjs,cjs}'],
        languageOptions: { parser: tsParser, ecmaVersion: 'latest', sourceType: 'module', parserOptions: { ecmaFeatures: { jsx: /x$/.test(file) } } },
        // Inline disable comments in the scanned code would hide reports (stack.md).
        linterOptions: { noInlineConfig: true, reportUnusedDisableDirectives: 'off' },
        rules: { complexity: ['error', { max: 0, variant }] },
      },
    ],
    { filename: file },
  );
  // A parse failure or a config that matched nothing comes back as a message without a rule.
  const problem = messages.find((m) => m.fatal || m.ruleId === null);
  if (problem) throw new Error(`eslint could not check ${file}:${problem.line ?? 0}: ${problem.message}`);
  return messages
    .filter((m) => m.ruleId === 'complexity')
    .map((m) => {
      const [, name, value] = MESSAGE.exec(m.message) ?? [];
      if (!value) throw new Error(`unexpected complexity message: ${m.message}`);
      const origin = /^Class field initializer$/i.test(name) ? 'class-field-initializer' : /^Class static block$/i.test(name) ? 'class-static-block' : 'function';
      return { line: m.line, column: m.column - 1, endLine: m.endLine ?? m.line, endColumn: (m.endColumn ?? m.column) - 1, origin, complexity: Number(value) };
    });
}
