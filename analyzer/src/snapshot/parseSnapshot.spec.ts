import { syntheticFunction, syntheticSnapshot } from './fixtures/syntheticSnapshot';
import { formatProblems, parseSnapshot, PROBLEMS_SHOWN } from './parseSnapshot';
import { SnapshotInputError } from './SnapshotInputError';

function text(mutate: (s: any) => void = () => undefined): string {
  const snapshot: any = JSON.parse(JSON.stringify(syntheticSnapshot([syntheticFunction({ cyclomatic: 3 })])));
  mutate(snapshot);
  return JSON.stringify(snapshot, null, 2);
}

function reasonOf(fn: () => unknown): string {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(SnapshotInputError);
    return (error as SnapshotInputError).reason;
  }
  throw new Error('expected a SnapshotInputError');
}

describe('parseSnapshot', () => {
  it('should return the snapshot of a valid text', () => {
    const parsed = parseSnapshot(text(), 'snap.json');
    expect(parsed.functions[0].cyclomatic).toBe(3);
  });

  it('should name the file and the line and column of a JSON syntax error', () => {
    const broken = '{\n  "schema": "seamline/snapshot@1",\n  "root": }';
    expect(reasonOf(() => parseSnapshot(broken, 'snap.json'))).toMatch(/^snap\.json is not valid JSON/);
    const truncated = '{\n  "schema": "seamline/snapshot@1",\n  "root": "x"';
    expect(reasonOf(() => parseSnapshot(truncated, 'snap.json'))).toMatch(/snap\.json is not valid JSON at line 3, column 14/);
  });

  it('should say an empty file is empty', () => {
    expect(reasonOf(() => parseSnapshot('  \n', 'empty.json'))).toBe('empty.json is not valid JSON: the file is empty');
  });

  it('should refuse JSON that is not a snapshot', () => {
    expect(reasonOf(() => parseSnapshot('[1, 2]', 'list.json'))).toMatch(/list\.json is not a Seamline snapshot/);
    expect(reasonOf(() => parseSnapshot('{"name": "pkg"}', 'package.json'))).toMatch(/not a Seamline snapshot/);
  });

  it('should name the schema version it found when it is not @1', () => {
    const reason = reasonOf(() => parseSnapshot(text((s) => (s.schema = 'seamline/snapshot@2')), 'new.json'));
    expect(reason).toBe('new.json is a "seamline/snapshot@2" file; this version of Seamline reads "seamline/snapshot@1"');
  });

  it('should list the first schema problems with their paths', () => {
    const reason = reasonOf(() => parseSnapshot(text((s) => (s.functions[0].decisions = 'two')), 'bad.json'));
    expect(reason).toBe('bad.json does not match the snapshot schema (1 problem):\n  /functions/0/decisions: must be integer');
  });

  it('should refuse two functions with the same id', () => {
    const snapshot = syntheticSnapshot([syntheticFunction({ cyclomatic: 2 }), syntheticFunction({ cyclomatic: 2, line: 30 })]);
    snapshot.functions[1].id = snapshot.functions[0].id;
    const reason = reasonOf(() => parseSnapshot(JSON.stringify(snapshot), 'dup.json'));
    expect(reason).toContain(`/functions/1/id: duplicate of /functions/0/id ('${snapshot.functions[0].id}')`);
  });

  it('should cut a long problem list short and say how many were left out', () => {
    const problems = Array.from({ length: PROBLEMS_SHOWN + 3 }, (_, i) => ({ path: `/functions/${i}/loc`, message: 'must be integer' }));
    const lines = formatProblems(problems).split('\n');
    expect(lines).toHaveLength(PROBLEMS_SHOWN + 1);
    expect(lines[PROBLEMS_SHOWN]).toBe('  … and 3 more');
    expect(formatProblems([{ path: '', message: "missing required property 'totals'" }])).toBe("  (top level): missing required property 'totals'");
  });
});
