import type { z } from 'zod';
import { HttpError } from './http-error';

/** Validates one part of a request with a shared zod schema; 400 naming the fields on failure. */
export function parse<S extends z.ZodType>(schema: S, value: unknown, part: 'body' | 'query' | 'params'): z.infer<S> {
  const result = schema.safeParse(value);
  if (result.success) return result.data;
  const fields: Record<string, string[]> = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length ? issue.path.join('.') : part;
    (fields[key] ??= []).push(issue.message);
  }
  throw new HttpError(400, 'invalid_request', `Invalid ${part}: check ${Object.keys(fields).join(', ')}`, fields);
}
