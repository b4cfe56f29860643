import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { ApiTokenList, CreatedApiToken, NewApiToken } from '../../../shared/api/api-schemas';

/** The signed-in user's personal API tokens: one method per endpoint. */
@Injectable({ providedIn: 'root' })
export class AccountApi {
  private readonly http = inject(HttpClient);

  listApiTokens(): Observable<ApiTokenList> {
    return this.http.get<ApiTokenList>('/api/v1/account/api-tokens');
  }

  createApiToken(request: NewApiToken): Observable<CreatedApiToken> {
    return this.http.post<CreatedApiToken>('/api/v1/account/api-tokens', request);
  }

  revokeApiToken(tokenId: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/account/api-tokens/${tokenId}`);
  }
}
