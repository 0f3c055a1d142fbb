// Calls for a build's systems and budgets: list with totals, add, edit (rename, budget, order, archive), contingency.
import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  CreateSystemRequest,
  SystemDto,
  SystemsResponse,
  UpdateContingencyRequest,
  UpdateSystemRequest,
} from '../../../../../shared/api/parts';
import { HANDLED_STATUSES } from '../../../core/http/api-error';

const buildPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}`;

@Injectable({ providedIn: 'root' })
export class SystemsApi {
  private readonly http = inject(HttpClient);

  /** The systems with their estimates and the build's totals; archived systems only when asked for. */
  list(buildId: string, includeArchived = false): Observable<SystemsResponse> {
    const params = includeArchived ? new HttpParams().set('archived', 'true') : undefined;
    return this.http.get<SystemsResponse>(`${buildPath(buildId)}/systems`, { params });
  }

  create(buildId: string, request: CreateSystemRequest): Observable<SystemDto> {
    return this.http.post<SystemDto>(`${buildPath(buildId)}/systems`, request);
  }

  /** Sends the version last seen; a 409 (someone else saved first) is explained by the page. */
  update(buildId: string, systemId: string, request: UpdateSystemRequest): Observable<SystemDto> {
    return this.http.patch<SystemDto>(`${buildPath(buildId)}/systems/${encodeURIComponent(systemId)}`, request, {
      context: new HttpContext().set(HANDLED_STATUSES, [409]),
    });
  }

  /** The contingency is part of the build, so it carries the build's version. */
  updateContingency(buildId: string, request: UpdateContingencyRequest): Observable<SystemsResponse> {
    return this.http.put<SystemsResponse>(`${buildPath(buildId)}/contingency`, request, {
      context: new HttpContext().set(HANDLED_STATUSES, [409]),
    });
  }
}
