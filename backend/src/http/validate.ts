// Request validation with the zod schemas shared with the client: bad input answers 400 naming each field.
import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { ValidationFailed, fieldsFromZod } from './errors';

/** Parses a value against a schema, throwing the API's validation error. */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw new ValidationFailed(fieldsFromZod(result.error));
  return result.data;
}

/** Middleware: replaces req.body with its parsed form, or answers 400. */
export function validBody(schema: z.ZodType): RequestHandler {
  return (req, _res, next) => {
    req.body = parseInput(schema, req.body);
    next();
  };
}
