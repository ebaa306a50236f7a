// The usage texts `--help` prints; docs/cli.md says the same at more length.

/** `seamline --help`. */
export const MAIN_HELP = `Usage: seamline <command> [options]

Commands:
  scan <dir>              analyse a TypeScript/JavaScript folder and write a snapshot,
                          SARIF or CSV
  check <snapshot.json>   exit 1 when a function's V(G) is over the limit (with a
                          baseline: only new or worsened ones)
  push <snapshot.json>    upload a snapshot to a Seamline server (in CI)

Options:
  -h, --help              show help (also: seamline <command> --help)
  --version               show Seamline's version

Exit codes: 0 fine, 1 check found functions over the limit (push --wait: the server could
not analyse the snapshot), 2 usage or input error (push: the server refused or could not be
reached), 3 unexpected failure.
`;

/** `seamline scan --help`. */
export const SCAN_HELP = `Usage: seamline scan <dir> [options]

Analyse every TypeScript/JavaScript file under <dir> (node_modules, .d.ts, generated and
minified files are skipped with a reason) and write the result to stdout or --out.

Output:
  -f, --format <f>        json (the snapshot, default), sarif (SARIF 2.1.0: one result per
                          function over the limit), csv, or graphml (the module map)
  --table <t>             the CSV table: functions (default), modules or clusters
  --level <l>             module level of graphml and the modules/clusters tables:
                          file, folder (default) or package
  -o, --out <file>        write to a file (atomically) instead of stdout
  --pretty                indent JSON and SARIF output
  --embed-source          put each function's source text in the snapshot

Counting:
  --limit <n>             V(G) above n is "over the limit" (default 10)
  --switch <cases|one>    count each case of a switch (default), or a switch as one decision
  --optional-chaining     count each ?. as a decision
  --default-values        count each default value as a decision

Input:
  --tsconfig <file>       the tsconfig.json whose file list is scanned (default:
                          <dir>/tsconfig.json when present, else every file under <dir>)
  --coverage <file>       import an lcov or Istanbul JSON coverage report
  --no-calls              skip the call graph (and so the module map, clusters and gravity)
  --folder-depth <n>      folder modules are the first n folders of a path (default 2)
  --resolution <r>        Louvain resolution for clusters (default 1)
  --max-line-length <n>   skip files with a longer line as minified (default 1000; 0: never)
  --threads <n>           analysis threads (default: as many as the code's size pays for,
                          up to one per core)

Progress goes to stderr, with a summary line at the end.
The limit of 10 is a rule of thumb, not a verdict: teams commonly allow up to 15 with a reason.
`;

/** `seamline check --help`. */
export const CHECK_HELP = `Usage: seamline check <snapshot.json> [options]

List the functions whose V(G) is over the limit and exit 1 if there are any.

Options:
  --limit <n>             the limit (default: the snapshot's own, as scanned)
  --baseline <old.json>   report only functions that are new over the limit, rose above it,
                          or rose further while above it; both snapshots must be counted
                          under the same settings

Exit codes: 0 nothing to report, 1 functions listed, 2 usage or input error.
The limit of 10 is a rule of thumb, not a verdict: teams commonly allow up to 15 with a reason.
`;
