import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, throwError } from 'rxjs';
import { describeHttpError } from './problem-details';

/** Shows the server's problem details to the user, then lets the caller handle the error too. */
export const problemDetailsInterceptor: HttpInterceptorFn = (request, next) => {
  const snackBar = inject(MatSnackBar);
  return next(request).pipe(
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse) {
        snackBar.open(describeHttpError(error), 'Dismiss', { duration: 8000, panelClass: 'rf-problem-snack' });
      }
      return throwError(() => error);
    }),
  );
};
