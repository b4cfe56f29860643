import { HttpContextToken, HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { SessionService } from './session-service';

/**
 * Set on requests the app makes by itself (loading the user's preferences): a refused token there
 * neither ends the session nor leaves the page, which may be the sign-in form being filled in. The
 * user's next own request meets the refusal.
 */
export const BACKGROUND_REQUEST = new HttpContextToken<boolean>(() => false);

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
      if (
        token &&
        error instanceof HttpErrorResponse &&
        error.status === 401 &&
        !request.context.get(BACKGROUND_REQUEST)
      ) {
        session.end();
        void router.navigate(['/accounts/sign-in'], { queryParams: { returnTo: router.url } });
      }
      return throwError(() => error);
    }),
  );
};
