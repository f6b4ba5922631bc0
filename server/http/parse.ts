import type { z } from 'zod';
import { HttpError } from './http-error';

// PostgreSQL's text types cannot hold U+0000 (it answers 22021, a 500 if it got that far), and an
// unpaired UTF-16 surrogate is not text at all (pg would store U+FFFD in its place). Both are
// refused here, for every string of every request part, before a schema sees them.
const NUL = /\u0000/; // eslint-disable-line no-control-regex -- NUL is what we look for
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
export const UNSTORABLE_TEXT_MESSAGE = 'must not contain NUL characters or unpaired surrogates';

/** Paths (`a.b.0`) of strings, keys included, that PostgreSQL text cannot store. Iterative: bodies may nest deeply. */
export function unstorableTextPaths(value: unknown): string[] {
  const bad = (s: string) => NUL.test(s) || LONE_SURROGATE.test(s);
  const found: string[] = [];
  const stack: Array<[unknown, string]> = [[value, '']];
  const join = (at: string, k: string | number) => (at ? `${at}.${k}` : String(k));
  while (stack.length) {
    const [v, at] = stack.pop()!;
    if (typeof v === 'string') {
      if (bad(v)) found.push(at);
    } else if (Array.isArray(v)) {
      v.forEach((item, i) => stack.push([item, join(at, i)]));
    } else if (v && typeof v === 'object') {
      for (const [k, item] of Object.entries(v)) {
        if (bad(k)) found.push(join(at, k.replaceAll('\u0000', '\\0')));
        else stack.push([item, join(at, k)]);
      }
    }
  }
  return found.sort();
}

/** Validates one part of a request with a shared zod schema; 400 naming the fields on failure. */
export function parse<S extends z.ZodType>(schema: S, value: unknown, part: 'body' | 'query' | 'params'): z.infer<S> {
  // No prototype: a field named like one of Object's own members (`constructor`, `toString`) is a
  // field like any other (fuzz: `fields.constructor.push is not a function` answered 500).
  const fields: Record<string, string[]> = Object.create(null) as Record<string, string[]>;
  for (const p of unstorableTextPaths(value)) (fields[p || part] ??= []).push(UNSTORABLE_TEXT_MESSAGE);
  if (Object.keys(fields).length === 0) {
    const result = schema.safeParse(value);
    if (result.success) return result.data;
    for (const issue of result.error.issues) {
      const key = issue.path.length ? issue.path.join('.') : part;
      (fields[key] ??= []).push(issue.message);
    }
  }
  throw new HttpError(400, 'invalid_request', `Invalid ${part}: check ${Object.keys(fields).join(', ')}`, fields);
}
