// Request parsing answers 400 naming the fields, whatever the fields are called.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { HttpError } from '../../server/http/http-error';
import { parse } from '../../server/http/parse';

describe('parse', () => {
  it("names a field called like one of Object's own members (found by the fuzz suite as a 500)", () => {
    const schema = z.object({ constructor: z.number(), toString: z.number() });
    let thrown: unknown;
    try {
      parse(schema, { constructor: 'x', toString: 'y' }, 'query');
    } catch (err) {
      thrown = err;
    }
    expect(thrown).toBeInstanceOf(HttpError);
    const e = thrown as HttpError;
    expect(e.status).toBe(400);
    expect(Object.keys(e.fields ?? {}).sort()).toEqual(['constructor', 'toString']);
  });
});
