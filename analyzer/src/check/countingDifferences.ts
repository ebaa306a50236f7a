import type { CountingSettings } from '../model/CountingSettings';

// The limit is not here: it changes which functions are reported, not what V(G) counts.
const COUNTING_KEYS = ['switch', 'optionalChaining', 'defaultValues'] as const;

/** The counting settings that differ between two snapshots (`switch: cases → one`); empty when V(G) is comparable. */
export function countingDifferences(baseline: CountingSettings, current: CountingSettings): string[] {
  return COUNTING_KEYS.filter((key) => baseline[key] !== current[key]).map(
    (key) => `${key}: ${String(baseline[key])} → ${String(current[key])}`,
  );
}
