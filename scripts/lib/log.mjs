// Console output of the start/test scripts: one prefix, so the user sees which step speaks.
export function step(message) {
  console.log(`\x1b[36m[seamline]\x1b[0m ${message}`);
}

export function warn(message) {
  console.warn(`\x1b[33m[seamline]\x1b[0m ${message}`);
}

/** Prints the error in words and exits non-zero; used for problems a person must fix. */
export function fail(message) {
  console.error(`\x1b[31m[seamline]\x1b[0m ${message}`);
  process.exit(1);
}
