import type { z } from 'zod';
import { BadRequestError } from '../errors';

/**
 * Parses a request's body, query or params with a zod schema; a mismatch is a 400 whose message
 * names each field and what is wrong with it.
 */
export function validate<S extends z.ZodType>(schema: S, value: unknown, what: 'body' | 'query' | 'params'): z.infer<S> {
  const parsed = schema.safeParse(value ?? {});
  if (parsed.success) return parsed.data;
  const problems = parsed.error.issues.map((i) => `${i.path.length ? i.path.join('.') : what}: ${i.message}`);
  throw new BadRequestError(`The request ${what} is not valid: ${problems.join('; ')}.`, { problems });
}
