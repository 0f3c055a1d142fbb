// Calls for a person's own mail alert choices on a build.
import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { AlertPreferencesDto, AlertPreferencesRequest } from '../../../../../shared/api/alerts';

const preferencesPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}/alert-preferences`;

@Injectable({ providedIn: 'root' })
export class AlertsApi {
  private readonly http = inject(HttpClient);

  preferences(buildId: string): Observable<AlertPreferencesDto> {
    return this.http.get<AlertPreferencesDto>(preferencesPath(buildId));
  }

  /** Replaces every choice at once: the request always carries all kinds. */
  save(buildId: string, request: AlertPreferencesRequest): Observable<AlertPreferencesDto> {
    return this.http.put<AlertPreferencesDto>(preferencesPath(buildId), request);
  }
}
