// Sends the session cookie with every API call and turns failures into ApiError, telling the person
// about errors no form field can show.
import { HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { Session } from '../auth/session';
import { ApiError, HANDLED_STATUSES, toApiError } from './api-error';

export const apiErrorInterceptor: HttpInterceptorFn = (request, next) => {
  const snackBar = inject(MatSnackBar);
  const router = inject(Router);
  const session = inject(Session);

  return next(request.clone({ withCredentials: true })).pipe(
    catchError((failure: unknown) => {
      const error: ApiError = toApiError(failure);
      const handledByCaller = request.context.get(HANDLED_STATUSES).includes(error.status);
      const isAuthCall = request.url.startsWith('/api/auth/');

      if (error.status === 401 && !isAuthCall) {
        // The session ended (expired or signed out elsewhere): send the person to sign in and back.
        session.clear();
        const returnTo = router.url;
        void router.navigate(['/sign-in'], { queryParams: returnTo.startsWith('/sign-in') ? {} : { returnTo } });
        snackBar.open('Your session has ended. Sign in to carry on.', 'Dismiss', { duration: 8000 });
      } else if (!handledByCaller && !error.hasFieldErrors) {
        // Field errors belong next to their fields; everything else needs a visible message.
        snackBar.open(error.message, 'Dismiss', { duration: 8000 });
      }
      return throwError(() => error);
    }),
  );
};
