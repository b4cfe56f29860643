import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  AcceptedMessage,
  AccountUser,
  InvitationAcceptance,
  NewPasswordRequest,
  PasswordResetRequest,
  RevokedApiTokens,
  SignInRequest,
  SignInResponse,
} from '../../../shared/api/api-schemas';
import { problemShownByCaller } from './problem-details-interceptor';

/** Sign-in, sign-out and the e-mailed links: one method per endpoint; the forms show their own problems. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  signIn(request: SignInRequest): Observable<SignInResponse> {
    return this.http.post<SignInResponse>('/api/v1/auth/sign-in', request, problemShownByCaller());
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/v1/auth/sign-out', null);
  }

  getCurrentUser(): Observable<AccountUser> {
    return this.http.get<AccountUser>('/api/v1/auth/me');
  }

  requestPasswordReset(request: PasswordResetRequest): Observable<AcceptedMessage> {
    return this.http.post<AcceptedMessage>('/api/v1/auth/forgot-password', request, problemShownByCaller());
  }

  resetPassword(request: NewPasswordRequest): Observable<RevokedApiTokens> {
    return this.http.post<RevokedApiTokens>('/api/v1/auth/reset-password', request, problemShownByCaller());
  }

  acceptInvitation(request: InvitationAcceptance): Observable<SignInResponse> {
    return this.http.post<SignInResponse>('/api/v1/auth/accept-invitation', request, problemShownByCaller());
  }
}
