// `seamline push --help`; docs/cli.md says the same at more length.

/** `seamline push --help`. */
export const PUSH_HELP = `Usage: seamline push <snapshot.json> --server <url> --codebase <name> [options]

Upload a snapshot made by \`seamline scan\` to a Seamline server (for CI pipelines). The file is
checked first; nothing is sent when it is not a valid snapshot.

Options:
  --server <url>          the server's address, http:// or https://
  --token <token>         a workspace API token (default: the SEAMLINE_TOKEN environment
                          variable, which keeps the token out of process lists and logs)
  --codebase <name>       the codebase on the server that the snapshot belongs to
  --commit <sha>          the commit that was scanned
  --branch <name>         the branch that was scanned
  --wait                  wait until the server has analysed the snapshot
  --timeout <seconds>     how long --wait waits (default 600)

Exit codes: 0 pushed (with --wait: analysed), 1 the server could not analyse the snapshot
(--wait), 2 usage or input error, the server refused the upload or could not be reached, or
--wait timed out.
`;
