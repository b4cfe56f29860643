import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  ApiTokenList,
  CreatedApiToken,
  NewApiToken,
  PasswordChange,
  RevokedApiTokens,
} from '../../../shared/api/api-schemas';
import { problemShownByCaller } from '../core/problem-details-interceptor';

/** The signed-in user's own account: password and personal API tokens, one method per endpoint. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  listApiTokens(): Observable<ApiTokenList> {
    return this.http.get<ApiTokenList>('/api/v1/account/api-tokens');
  }

  createApiToken(request: NewApiToken): Observable<CreatedApiToken> {
    return this.http.post<CreatedApiToken>('/api/v1/account/api-tokens', request, problemShownByCaller());
  }

  revokeApiToken(tokenId: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/account/api-tokens/${tokenId}`);
  }

  changePassword(request: PasswordChange): Observable<RevokedApiTokens> {
    return this.http.put<RevokedApiTokens>('/api/v1/account/password', request, problemShownByCaller());
  }
}
