// Request validation from zod schemas: params, query and body, answered with 400 and the field paths on failure.
import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { badRequest } from './errors';

interface Schemas {
  params?: z.ZodType;
  query?: z.ZodType;
  body?: z.ZodType;
}

export type Validated<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.infer<S[K]> : never;
};

export function validate<S extends Schemas>(schemas: S): RequestHandler {
  return (req, res, next) => {
    const issues: { path: string; message: string }[] = [];
    const out: Record<string, unknown> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(part === 'body' ? (req.body ?? {}) : req[part]);
      if (result.success) out[part] = result.data;
      else for (const i of result.error.issues) issues.push({ path: [part, ...i.path].join('.'), message: i.message });
    }
    if (issues.length > 0) return next(badRequest('The request is not valid', issues));
    res.locals.valid = out;
    next();
  };
}

/** The validated parts of the current request, typed by the schemas given to `validate`. */
export function valid<S extends Schemas>(res: { locals: Record<string, unknown> }, _schemas: S): Validated<S> {
  return res.locals.valid as Validated<S>;
}
