/**
 * SARIF log of functions over the limit
 * =====================================
 * One SARIF 2.1.0 run with one rule, `function-over-limit`, and one result per function whose
 * reported V(G) is above the snapshot's limit, located by its file (posix path relative to the
 * scanned root, under the `SRCROOT` base id) and its first and last line. The function's
 * fingerprint goes into `partialFingerprints`, so a code host follows a finding when the
 * function moves. Results keep the snapshot's order.
 *
 * [Reference]: OASIS SARIF 2.1.0 (the sarifLog, run, result and reportingDescriptor objects).
 */
import type { Log, ReportingDescriptor, Result } from 'sarif';
import type { FunctionRecord } from '../model/FunctionRecord';
import type { Snapshot } from '../model/Snapshot';

/** The id of Seamline's one SARIF rule. */
export const OVER_LIMIT_RULE_ID = 'function-over-limit';

// The OASIS location of the 2.1.0 schema (errata 01 edition); common practice to cite it in $schema.
const SARIF_SCHEMA = 'https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json';

/** The caution shown with every limit: V(G) guides, it does not judge. */
export const LIMIT_CAUTION =
  'V(G) is guidance, not a verdict: a limit of 10 is a rule of thumb (teams commonly allow up to 15 with a reason), ' +
  'splitting a function raises the total by one per new function while the decisions stay the same, ' +
  'and a large flat switch reads more simply than its number suggests.';

function overLimitRule(limit: number): ReportingDescriptor {
  return {
    id: OVER_LIMIT_RULE_ID,
    name: 'FunctionOverLimit',
    shortDescription: { text: `Cyclomatic complexity V(G) above ${limit}` },
    fullDescription: {
      text:
        `The function's cyclomatic complexity V(G) (McCabe 1976: decisions + 1, counted on its control-flow graph) ` +
        `is above the limit of ${limit}. Each unit of V(G) is one more independent path to test. ${LIMIT_CAUTION}`,
    },
    help: {
      text:
        `Consider whether the function does several things that could be named separately, or whether a table ` +
        `or early returns would express the decisions more plainly. ${LIMIT_CAUTION}`,
    },
    defaultConfiguration: { level: 'warning' },
    properties: { tags: ['maintainability', 'complexity'] },
  };
}

function decisionsText(n: number): string {
  return n === 1 ? '1 decision' : `${n} decisions`;
}

function overLimitResult(fn: FunctionRecord, limit: number): Result {
  return {
    ruleId: OVER_LIMIT_RULE_ID,
    ruleIndex: 0,
    level: 'warning',
    message: {
      text: `'${fn.qualifiedName}' has V(G) ${fn.cyclomatic} (${decisionsText(fn.decisions)}), above the limit of ${limit}.`,
    },
    locations: [
      {
        physicalLocation: {
          artifactLocation: { uri: encodeUriPath(fn.file), uriBaseId: 'SRCROOT' },
          region: { startLine: fn.line, endLine: fn.endLine },
        },
        logicalLocations: [{ name: fn.name || undefined, fullyQualifiedName: fn.qualifiedName, kind: 'function' }],
      },
    ],
    partialFingerprints: { 'seamlineFunctionFingerprint/v1': fn.fingerprint },
    properties: { cyclomatic: fn.cyclomatic, decisions: fn.decisions, essential: fn.essential, limit },
  };
}

// OASIS SARIF 2.1.0: artifactLocation.uri is a URI reference (RFC 3986), so each path segment is percent-encoded.
function encodeUriPath(posixPath: string): string {
  return posixPath.split('/').map(encodeURIComponent).join('/');
}

/** A SARIF 2.1.0 log with one result per function whose reported V(G) is above the snapshot's limit. */
export function toSarif(snapshot: Snapshot): Log {
  const limit = snapshot.settings.limit;
  return {
    $schema: SARIF_SCHEMA,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: 'Seamline',
            version: snapshot.generator.version,
            // OASIS SARIF 2.1.0: semanticVersion must be semver (from memory); other version strings stay in `version` only.
            semanticVersion: /^\d+\.\d+\.\d+/.test(snapshot.generator.version) ? snapshot.generator.version : undefined,
            rules: [overLimitRule(limit)],
          },
        },
        results: snapshot.functions.filter((fn) => fn.cyclomatic > limit).map((fn) => overLimitResult(fn, limit)),
        properties: { countingSettings: snapshot.settings, scannedRoot: snapshot.root },
      },
    ],
  };
}
