import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Preferences, PreferencesInput } from '../../../shared/api/api-schemas';
import { BACKGROUND_REQUEST } from './auth-token-interceptor';
import { PROBLEM_SHOWN_BY_CALLER } from './problem-details-interceptor';

/** Asked by the app itself, and quiet when refused: no snack bar, no sign-in page. */
const quietly = () => ({ context: new HttpContext().set(PROBLEM_SHOWN_BY_CALLER, true).set(BACKGROUND_REQUEST, true) });

/**
 * The signed-in user's preferences kept on the server, one method per endpoint. A failure is the
 * caller's to handle: the page keeps this browser's copy and raises no alarm over a layout choice,
 * nor sends the user to sign in again over a request they did not make.
 */
@Injectable({ providedIn: 'root' })
export class PreferencesApi {
  private readonly http = inject(HttpClient);

  getPreferences(): Observable<Preferences> {
    return this.http.get<Preferences>('/api/v1/account/preferences', quietly());
  }

  updatePreferences(preferences: PreferencesInput): Observable<Preferences> {
    return this.http.put<Preferences>('/api/v1/account/preferences', preferences, quietly());
  }
}
