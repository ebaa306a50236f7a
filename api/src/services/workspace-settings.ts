import { z } from 'zod';
import { DEFAULT_SETTINGS, type CountingSettings } from '../analyzer-lib';

/** What owners set per workspace: the limit and counting settings new analyses use. */
export const workspaceSettingsSchema = z.object({
  limit: z.number().int().min(1).max(1000),
  switch: z.enum(['cases', 'one']),
  optionalChaining: z.boolean(),
  defaultValues: z.boolean(),
}).strict();

export const workspaceSettingsPatch = workspaceSettingsSchema.partial().strict();

/** The stored settings over the published defaults (McCabe's strict rules, limit 10). */
export function effectiveSettings(stored: Record<string, unknown>): CountingSettings {
  const parsed = workspaceSettingsSchema.partial().safeParse(stored);
  return { ...DEFAULT_SETTINGS, ...(parsed.success ? parsed.data : {}) };
}
