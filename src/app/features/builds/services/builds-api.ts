// Calls to /api/builds: list, create, read, edit, archive and restore a build.
import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { BuildDto, CreateBuildRequest, UpdateBuildRequest } from '../../../../../shared/api/builds';
import { HANDLED_STATUSES } from '../../../core/http/api-error';

@Injectable({ providedIn: 'root' })
export class BuildsApi {
  private readonly http = inject(HttpClient);

  /** Builds the caller belongs to; archived ones only when asked for. */
  list(includeArchived = false): Observable<BuildDto[]> {
    const params = includeArchived ? new HttpParams().set('archived', 'true') : undefined;
    return this.http.get<{ builds: BuildDto[] }>('/api/builds', { params }).pipe(map((response) => response.builds));
  }

  /** A missing build (or one the caller is not on) answers 404; the page says so itself. */
  get(buildId: string): Observable<BuildDto> {
    return this.http.get<BuildDto>(`/api/builds/${encodeURIComponent(buildId)}`, {
      context: new HttpContext().set(HANDLED_STATUSES, [404]),
    });
  }

  create(request: CreateBuildRequest): Observable<BuildDto> {
    return this.http.post<BuildDto>('/api/builds', request);
  }

  /** Sends the version last seen; a 409 (someone else saved first) is shown by the form. */
  update(buildId: string, request: UpdateBuildRequest): Observable<BuildDto> {
    return this.http.patch<BuildDto>(`/api/builds/${encodeURIComponent(buildId)}`, request, {
      context: new HttpContext().set(HANDLED_STATUSES, [409]),
    });
  }

  archive(buildId: string): Observable<void> {
    return this.http.delete<void>(`/api/builds/${encodeURIComponent(buildId)}`);
  }

  restore(buildId: string): Observable<BuildDto> {
    return this.http.post<BuildDto>(`/api/builds/${encodeURIComponent(buildId)}/restore`, null);
  }
}
