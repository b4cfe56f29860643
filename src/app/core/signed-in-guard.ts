import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { SessionService } from './session-service';

/** Pages for signed-in users: anyone else goes to the sign-in page, and comes back after. */
export const signedInGuard: CanActivateFn = (_route, state) => {
  if (inject(SessionService).token()) return true;
  return inject(Router).createUrlTree(['/accounts/sign-in'], { queryParams: { returnTo: state.url } });
};
