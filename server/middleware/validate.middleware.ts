import type { Request } from 'express';
import { z } from 'zod';

type Schemas = { body?: z.ZodType; params?: z.ZodType; query?: z.ZodType };
type Parsed<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never;
};

/**
 * Parses the parts of a request a route uses with zod and returns them typed. Throws a
 * ZodError (which the error middleware turns into 400 invalid_input with fields) when any
 * part fails; issues from every part are reported together.
 *
 *   const { params, body } = validate(req, { params: idParams, body: projectPatch });
 */
export function validate<S extends Schemas>(req: Request, schemas: S): Parsed<S> {
  const out: Record<string, unknown> = {};
  const issues: z.core.$ZodIssue[] = [];
  const sources = { body: req.body ?? {}, params: req.params ?? {}, query: req.query ?? {} };
  for (const part of ['params', 'query', 'body'] as const) {
    const schema = schemas[part];
    if (!schema) continue;
    const result = schema.safeParse(sources[part]);
    if (result.success) out[part] = result.data;
    else issues.push(...result.error.issues);
  }
  if (issues.length > 0) throw new z.ZodError(issues);
  return out as Parsed<S>;
}

/** Shared param schema for routes addressed by a UUID id. */
export const idParams = z.object({ id: z.uuid({ error: 'Must be a valid id' }) });
