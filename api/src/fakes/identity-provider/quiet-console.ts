type ConsoleMethod = 'log' | 'warn' | 'error';

/**
 * Runs synchronous `work` with the given console methods silenced. The SAML libraries used by
 * the fake print from inside calls that report the same facts through their return value
 * (the emscripten xmllint prints blank lines; samlify warns about the missing logout endpoint).
 */
export function quietly<T>(methods: ConsoleMethod[], work: () => T): T {
  const saved = methods.map((m) => [m, console[m]] as const);
  for (const m of methods) console[m] = () => undefined;
  try {
    return work();
  } finally {
    for (const [m, fn] of saved) console[m] = fn;
  }
}
