// One jest run for every part: each project keeps its tests beside its code.
const swc = ['@swc/jest', {
  jsc: {
    parser: { syntax: 'typescript', decorators: true },
    transform: { legacyDecorator: true, decoratorMetadata: true },
    target: 'es2022',
  },
  module: { type: 'commonjs' },
}];

const node = (name, roots, extra = {}) => ({
  displayName: name,
  testEnvironment: 'node',
  roots,
  testMatch: ['**/*.spec.ts', '**/*.test.ts'],
  transform: { '^.+\\.ts$': swc },
  ...extra,
});

module.exports = {
  projects: [
    node('analyzer', ['<rootDir>/analyzer']),
    node('api', ['<rootDir>/api'], { setupFiles: ['reflect-metadata'] }),
    '<rootDir>/web/jest.config.js',
    // The invented demo codebase's own checks (it is scanned, never run).
    node('fixtures', ['<rootDir>/test/fixtures'], { testMatch: ['**/*.spec.ts'] }),
    node('e2e', ['<rootDir>/test'], {
      testMatch: ['**/*.e2e.ts'],
      setupFiles: ['reflect-metadata'],
    }),
  ],
  testTimeout: 30000,
};
