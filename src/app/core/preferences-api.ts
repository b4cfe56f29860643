import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { Preferences, PreferencesInput } from '../../../shared/api/api-schemas';
import { problemShownByCaller } from './problem-details-interceptor';

/**
 * The signed-in user's preferences kept on the server, one method per endpoint. A failure is the
 * caller's to handle: the page keeps this browser's copy and raises no alarm over a layout choice.
 */
@Injectable({ providedIn: 'root' })
export class PreferencesApi {
  private readonly http = inject(HttpClient);

  getPreferences(): Observable<Preferences> {
    return this.http.get<Preferences>('/api/v1/account/preferences', problemShownByCaller());
  }

  updatePreferences(preferences: PreferencesInput): Observable<Preferences> {
    return this.http.put<Preferences>('/api/v1/account/preferences', preferences, problemShownByCaller());
  }
}
