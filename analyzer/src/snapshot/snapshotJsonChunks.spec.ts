import fc from 'fast-check';
import { syntheticFunction, syntheticSnapshot } from './fixtures/syntheticSnapshot';
import { snapshotJsonChunks } from './snapshotJsonChunks';

const join = (chunks: Iterable<string>) => [...chunks].join('');

describe('snapshotJsonChunks', () => {
  const snapshot = syntheticSnapshot([
    syntheticFunction({ cyclomatic: 1 }),
    syntheticFunction({ cyclomatic: 5, line: 20, qualifiedName: 'A.b "quoted"\n' }),
  ]);

  it('should give exactly the text JSON.stringify gives, compact and pretty', () => {
    // ECMA-262 JSON.stringify is the reference for both layouts.
    expect(join(snapshotJsonChunks(snapshot))).toBe(JSON.stringify(snapshot));
    expect(join(snapshotJsonChunks(snapshot, { pretty: true }))).toBe(`${JSON.stringify(snapshot, null, 2)}\n`);
  });

  it('should yield one chunk per function, so a large snapshot is never one string', () => {
    const chunks = [...snapshotJsonChunks(snapshot)];
    expect(chunks.filter((c) => c.includes('"fingerprint"'))).toHaveLength(2);
  });

  it('should leave out undefined members and handle an empty function list', () => {
    const empty = { ...syntheticSnapshot([]), coverage: undefined };
    expect(join(snapshotJsonChunks(empty))).toBe(JSON.stringify(empty));
    expect(join(snapshotJsonChunks(empty, { pretty: true }))).toBe(`${JSON.stringify(empty, null, 2)}\n`);
  });

  it('should match JSON.stringify for any names and any number of functions', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.string(), fc.integer({ min: 1, max: 6 })), { maxLength: 6 }), fc.boolean(), (specs, pretty) => {
        const fns = specs.map(([name, v], i) => syntheticFunction({ cyclomatic: v, line: i * 10 + 1, qualifiedName: `${name}${i}` }));
        const s = syntheticSnapshot(fns);
        const expected = pretty ? `${JSON.stringify(s, null, 2)}\n` : JSON.stringify(s);
        expect(join(snapshotJsonChunks(s, { pretty }))).toBe(expected);
      }),
      { numRuns: 300 },
    );
  });
});
