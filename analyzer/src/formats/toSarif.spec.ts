import { syntheticFunction, syntheticSnapshot } from '../snapshot/fixtures/syntheticSnapshot';
import { OVER_LIMIT_RULE_ID, toSarif } from './toSarif';

describe('toSarif', () => {
  const over = syntheticFunction({ cyclomatic: 14, line: 20, file: 'src/orders/assign.ts', qualifiedName: 'Orders.assign' });
  const under = syntheticFunction({ cyclomatic: 3, line: 80, file: 'src/orders/assign.ts' });
  const atLimit = syntheticFunction({ cyclomatic: 10, line: 120 });
  const snapshot = syntheticSnapshot([under, over, atLimit]);
  const log = toSarif(snapshot);

  it('should carry the properties SARIF 2.1.0 requires of a log, a run and a tool', () => {
    // OASIS SARIF 2.1.0: a log has version "2.1.0", $schema and runs; a run has tool.driver.name (from memory: which members are required).
    expect(log.version).toBe('2.1.0');
    expect(log.$schema).toMatch(/sarif-schema-2\.1\.0\.json$/);
    expect(log.runs).toHaveLength(1);
    expect(log.runs[0].tool.driver.name).toBe('Seamline');
    expect(log.runs[0].tool.driver.version).toBe('0.1.0');
  });

  it('should declare one rule whose description carries the caution', () => {
    const rules = log.runs[0].tool.driver.rules!;
    expect(rules.map((r) => r.id)).toEqual([OVER_LIMIT_RULE_ID]);
    expect(rules[0].fullDescription!.text).toMatch(/rule of thumb \(teams commonly allow up to 15 with a reason\)/);
    expect(rules[0].defaultConfiguration!.level).toBe('warning');
  });

  it('should give one result per function over the limit, at its file and lines', () => {
    // OASIS SARIF 2.1.0: a result needs a message, ruleId ties it to the rule, region lines are 1-based (from memory).
    const results = log.runs[0].results!;
    expect(results).toHaveLength(1);
    const [result] = results;
    expect(result.ruleId).toBe(OVER_LIMIT_RULE_ID);
    expect(result.ruleIndex).toBe(0);
    expect(result.level).toBe('warning');
    expect(result.message.text).toBe("'Orders.assign' has V(G) 14 (13 decisions), above the limit of 10.");
    const location = result.locations![0].physicalLocation!;
    expect(location.artifactLocation!.uri).toBe('src/orders/assign.ts');
    expect(location.region).toEqual({ startLine: 20, endLine: over.endLine });
    expect(result.partialFingerprints).toEqual({ 'seamlineFunctionFingerprint/v1': over.fingerprint });
    expect(result.locations![0].logicalLocations![0].fullyQualifiedName).toBe('Orders.assign');
  });

  it('should follow the snapshot limit', () => {
    const strict = toSarif(syntheticSnapshot([under, over, atLimit], { limit: 5 }));
    expect(strict.runs[0].results!.map((r) => r.locations![0].physicalLocation!.region!.startLine)).toEqual([20, 120]);
    expect(toSarif(syntheticSnapshot([under], { limit: 5 })).runs[0].results).toEqual([]);
  });

  it('should percent-encode a path that is not a valid URI reference as it stands', () => {
    const spaced = syntheticFunction({ cyclomatic: 11, file: 'src/my folder/a#b.ts' });
    const uri = toSarif(syntheticSnapshot([spaced])).runs[0].results![0].locations![0].physicalLocation!.artifactLocation!.uri;
    expect(uri).toBe('src/my%20folder/a%23b.ts');
    expect(decodeURIComponent(uri!)).toBe('src/my folder/a#b.ts');
  });
});
