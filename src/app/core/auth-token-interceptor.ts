import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { SessionService } from './session-service';

/**
 * Adds the session's bearer token to the API's requests. When the API no longer accepts the
 * token (it expired or was revoked), the session ends and the sign-in page opens.
 */
export const authTokenInterceptor: HttpInterceptorFn = (request, next) => {
  const session = inject(SessionService);
  const router = inject(Router);
  const token = request.url.startsWith('/api/') ? session.token() : null;
  const sent = token ? request.clone({ setHeaders: { Authorization: `Bearer ${token}` } }) : request;
  return next(sent).pipe(
    catchError((error: unknown) => {
      if (token && error instanceof HttpErrorResponse && error.status === 401) {
        session.end();
        void router.navigate(['/accounts/sign-in'], { queryParams: { returnTo: router.url } });
      }
      return throwError(() => error);
    }),
  );
};
