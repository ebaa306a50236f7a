const UNITS = ['bytes', 'KB', 'MB', 'GB', 'TB'];

/** A byte count as people read it in a refusal: `1 byte`, `900 bytes`, `1.5 MB`, `200 MB`. */
export function formatBytes(bytes: number): string {
  if (bytes === 1) return '1 byte';
  let value = bytes;
  let unit = 0;
  while (value >= 1024 && unit < UNITS.length - 1) {
    value /= 1024;
    unit++;
  }
  const shown = unit === 0 || Number.isInteger(value) ? String(value) : value.toFixed(1).replace(/\.0$/, '');
  return `${shown} ${UNITS[unit]}`;
}
