import { HttpContext, HttpContextToken, HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { Injector, inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';
import { describeHttpError } from './problem-details';

/** Set on requests whose caller shows the problem next to the form, so it is not said twice. */
export const PROBLEM_SHOWN_BY_CALLER = new HttpContextToken<boolean>(() => false);

/** The context for a form's request: its problem appears in the form, not in a snack bar. */
export function problemShownByCaller(): { context: HttpContext } {
  return { context: new HttpContext().set(PROBLEM_SHOWN_BY_CALLER, true) };
}

/**
 * Shows the server's problem details to the user, then lets the caller handle the error too. The
 * snack bar (and the overlay under it) loads with the first problem, not with the first page.
 */
export const problemDetailsInterceptor: HttpInterceptorFn = (request, next) => {
  const injector = inject(Injector);
  return next(request).pipe(
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse && !request.context.get(PROBLEM_SHOWN_BY_CALLER)) {
        const message = describeHttpError(error);
        void import('@angular/material/snack-bar').then(({ MatSnackBar }) =>
          injector.get(MatSnackBar).open(message, 'Dismiss', { duration: 8000, panelClass: 'rf-problem-snack' }),
        );
      }
      return throwError(() => error);
    }),
  );
};
