/**
 * Snapshot JSON, in chunks
 * ========================
 * Serialises a snapshot as the JSON text `JSON.stringify` would give (same key order, `undefined`
 * members left out), but yields it one function record at a time, so a large codebase never
 * needs the whole file in one string (V8 caps a string at about 2^29 characters). Compact by
 * default; `pretty` indents by two spaces.
 *
 * [Reference]: ECMA-262 JSON.stringify; ECMA-404.
 */
import type { Snapshot } from '../model/Snapshot';

/** How the snapshot JSON is laid out. */
export interface SnapshotJsonOptions {
  /** Indent by two spaces and put each member on its own line (default false: compact). */
  pretty?: boolean;
}

function indentLines(text: string, indent: string): string {
  return indent === '' ? text : text.replace(/\n/g, `\n${indent}`);
}

/** The snapshot's JSON text in chunks whose concatenation parses back to an equal value. */
export function* snapshotJsonChunks(snapshot: Snapshot, options: SnapshotJsonOptions = {}): Generator<string> {
  const space = options.pretty ? 2 : undefined;
  const nl = options.pretty ? '\n' : '';
  const one = options.pretty ? '  ' : '';
  const two = options.pretty ? '    ' : '';
  const colon = options.pretty ? ': ' : ':';
  const members = Object.entries(snapshot).filter(([, value]) => value !== undefined && typeof value !== 'function');
  yield '{';
  for (let m = 0; m < members.length; m++) {
    const [key, value] = members[m];
    const head = `${m === 0 ? '' : ','}${nl}${one}${JSON.stringify(key)}${colon}`;
    if (key === 'functions' && Array.isArray(value) && value.length > 0) {
      yield `${head}[`;
      for (let i = 0; i < value.length; i++) {
        yield `${i === 0 ? '' : ','}${nl}${two}${indentLines(JSON.stringify(value[i], null, space), two)}`;
      }
      yield `${nl}${one}]`;
    } else {
      yield head + indentLines(JSON.stringify(value, null, space), one);
    }
  }
  yield `${members.length > 0 ? nl : ''}}${nl}`;
}
