// The one error shape every API failure answers with.

export interface ApiErrorBody {
  error: {
    /** Machine-readable: validation_failed, not_found, conflict, unauthenticated, forbidden, csrf_failed, rate_limited, internal. */
    code: string;
    /** A sentence a person can act on. */
    message: string;
    /** Field name (dotted path for nested fields) to the problem with it. */
    fields?: Record<string, string>;
    /** On a stale edit (code stale_version): the record as it is saved now. */
    current?: unknown;
  };
}

export function isApiErrorBody(value: unknown): value is ApiErrorBody {
  const error = (value as ApiErrorBody | null)?.error;
  return !!error && typeof error.code === 'string' && typeof error.message === 'string';
}
