/**
 * Coverage report, normalised
 * ===========================
 * What Seamline keeps of an lcov or Istanbul JSON report: per file, the branch records (one
 * per branch point, with a hit count per outcome), the line hits and the function hits. Both
 * formats are brought to this one shape so the mapping onto flow graphs does not care which
 * tool wrote the report. Lines are 1-based, columns 1-based.
 */

/** Which file format a report came in. */
export type CoverageFormat = 'lcov' | 'istanbul';

/**
 * Istanbul's branch types (`if`, `cond-expr`, `binary-expr`, `switch`, `default-arg`); other
 * instrumenters may write other strings, which the mapping treats as unknown.
 */
export type BranchType = 'if' | 'cond-expr' | 'binary-expr' | 'switch' | 'default-arg';

/** One branch point of a report: `BRDA` lines sharing line and block, or one Istanbul `branchMap` entry. */
export interface BranchRecord {
  /** Line of the branch point (Istanbul: where the whole construct starts). */
  line: number;
  /** The report's own id of the branch point (lcov block number, Istanbul branch key). */
  block: string;
  /** Istanbul's type; absent for lcov, which does not say. */
  type?: string;
  /** Hits per outcome in report order; `null` where lcov wrote `-` (the branch point never ran). */
  counts: (number | null)[];
  /** Istanbul only: where each outcome starts (null when the report gives no place). */
  locations?: ({ line: number; column: number } | null)[];
}

/** How often one function was entered. */
export interface FunctionHits {
  name: string;
  /** Line of the function's declaration (its name, or its start for anonymous ones). */
  line: number;
  /** Last line, when the format gives it (Istanbul, lcov 2 `FN:start,end,name`). */
  endLine?: number;
  calls: number;
}

/** Everything a report says about one source file. */
export interface FileCoverage {
  /** In report order (Istanbul: branch key order, which is the instrumenter's pre-order walk). */
  branches: BranchRecord[];
  /** Line → hits (lcov `DA`; for Istanbul the largest count of the statements starting on the line). */
  lines: Map<number, number>;
  functions: FunctionHits[];
}

/** A parsed report: files keyed by the path exactly as the report wrote it. */
export interface CoverageReport {
  format: CoverageFormat;
  files: Map<string, FileCoverage>;
}
