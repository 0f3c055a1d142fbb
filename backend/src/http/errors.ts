// Domain errors thrown by services and routes, and the one middleware that maps them to the API's error shape.
import type { ErrorRequestHandler } from 'express';
import { OptimisticLockError, UniqueConstraintViolationException } from '@mikro-orm/core';
import { z } from 'zod';
import type { ApiErrorBody } from '../../../shared/api/errors';

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** Extra members of the error object, such as the current record on a stale edit. */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export class ValidationFailed extends AppError {
  constructor(fields: Record<string, string>, message = 'Some fields need attention.') {
    super(400, 'validation_failed', message, fields);
  }
}

export class NotFound extends AppError {
  constructor(what = 'That') {
    super(404, 'not_found', `${what} was not found. It may have been removed, or you may not have access.`);
  }
}

export class Conflict extends AppError {
  constructor(message: string, fields?: Record<string, string>) {
    super(409, 'conflict', message, fields);
  }
}

export class StaleVersion extends AppError {
  /** `current` is the record as saved now, so the client can show what changed. */
  constructor(what = 'This record', current?: unknown) {
    super(409, 'stale_version', `${what} was changed by someone else since you opened it. Check their changes, then save again.`, undefined, current === undefined ? undefined : { current });
  }
}

export class Unauthenticated extends AppError {
  constructor(message = 'Sign in to continue.') {
    super(401, 'unauthenticated', message);
  }
}

export class Forbidden extends AppError {
  constructor(message = 'Your role on this build does not allow that.') {
    super(403, 'forbidden', message);
  }
}

/** Turns a zod error into field messages keyed by dotted path. */
export function fieldsFromZod(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    if (!fields[key]) fields[key] = issue.code === 'unrecognized_keys' ? `Unknown field: ${(issue as { keys: string[] }).keys.join(', ')}.` : issue.message;
  }
  return fields;
}

export function errorBody(code: string, message: string, fields?: Record<string, string>, extra?: Record<string, unknown>): ApiErrorBody {
  return { error: { code, message, ...(fields ? { fields } : {}), ...extra } };
}

export const errorMiddleware: ErrorRequestHandler = (err, _req, res, _next) => {
  // A stream that failed after its headers went out (a download cut short): the body cannot be an error any more,
  // so the connection is ended abruptly and the client sees an incomplete download, never a complete-looking one.
  if (res.headersSent) {
    if ((err as { code?: string }).code !== 'ERR_STREAM_PREMATURE_CLOSE') console.error('response failed mid-stream:', err);
    res.destroy();
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json(errorBody(err.code, err.message, err.fields, err.extra));
    return;
  }
  if (err instanceof OptimisticLockError) {
    const stale = new StaleVersion();
    res.status(stale.status).json(errorBody(stale.code, stale.message));
    return;
  }
  // Two requests creating the same thing at once: the database's unique index refused the second.
  if (err instanceof UniqueConstraintViolationException) {
    const conflict = new Conflict('That was just saved by another request. Reload to see it, then try again if needed.');
    res.status(conflict.status).json(errorBody(conflict.code, conflict.message));
    return;
  }
  if (err instanceof z.ZodError) {
    res.status(400).json(errorBody('validation_failed', 'Some fields need attention.', fieldsFromZod(err)));
    return;
  }
  // body-parser: malformed JSON or a body over the limit.
  const status = (err as { status?: number; type?: string }).status;
  if (status === 400 || status === 413) {
    const tooLarge = status === 413;
    res.status(status).json(errorBody(tooLarge ? 'too_large' : 'malformed_request', tooLarge ? 'The request is too large.' : 'The request body is not valid JSON.'));
    return;
  }
  console.error(err);
  res.status(500).json(errorBody('internal', 'Something went wrong on our side. Try again; if it keeps happening, tell us what you were doing.'));
};
