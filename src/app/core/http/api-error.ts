// The client's one error type: every failed API call reaches components as an ApiError.
import { HttpContextToken, HttpErrorResponse } from '@angular/common/http';
import { isApiErrorBody } from '../../../../shared/api/errors';

/** HTTP statuses the caller handles on screen itself, so the interceptor shows no snack bar for them. */
export const HANDLED_STATUSES = new HttpContextToken<readonly number[]>(() => []);

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    /** Field name to message; forms put these on their controls. */
    readonly fields: Readonly<Record<string, string>> = {},
    /** On a stale edit (code stale_version): the record as it is saved now, when the API sends it. */
    readonly current?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }

  get hasFieldErrors(): boolean {
    return Object.keys(this.fields).length > 0;
  }
}

const fallbackMessages: Record<number, string> = {
  0: 'Tallyhood could not be reached. Check your connection and try again.',
  401: 'You are signed out. Sign in and try again.',
  403: 'You do not have permission to do that on this build.',
  404: 'That was not found. It may have been removed, or you may no longer have access.',
  409: 'Someone else changed this in the meantime. Reload and try again.',
  429: 'Too many attempts in a short time. Wait a minute and try again.',
};

/** Reads the API's error shape `{"error":{"code","message","fields"}}`, with a plain fallback for anything else. */
export function toApiError(error: unknown): ApiError {
  if (error instanceof ApiError) return error;
  if (error instanceof HttpErrorResponse) {
    if (isApiErrorBody(error.error)) {
      const body = error.error.error;
      return new ApiError(error.status, body.code, body.message, body.fields ?? {}, body.current);
    }
    const message =
      fallbackMessages[error.status] ??
      (error.status >= 500
        ? 'Something went wrong on our side. Try again in a moment; if it keeps happening, let us know.'
        : 'That request could not be completed. Check what you entered and try again.');
    return new ApiError(error.status, error.status === 0 ? 'network' : 'http_' + error.status, message);
  }
  return new ApiError(0, 'unknown', 'Something unexpected went wrong. Reload the page and try again.');
}
