// Calls for a build's parts: list, add, edit with a version check, remove, bulk changes and the CSV import.
import { HttpClient, HttpContext, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type {
  BulkPartsRequest,
  CreatePartRequest,
  ImportPreviewDto,
  ImportResultDto,
  PartDto,
  PartsResponse,
  UpdatePartRequest,
} from '../../../../../shared/api/parts';
import type { PartStatus } from '../../../../../shared/enums';
import { HANDLED_STATUSES } from '../../../core/http/api-error';

const buildPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}`;

export interface PartsFilter {
  systemId?: string;
  status?: PartStatus;
}

@Injectable({ providedIn: 'root' })
export class PartsApi {
  private readonly http = inject(HttpClient);

  list(buildId: string, filter: PartsFilter = {}): Observable<PartDto[]> {
    let params = new HttpParams();
    if (filter.systemId) params = params.set('systemId', filter.systemId);
    if (filter.status) params = params.set('status', filter.status);
    return this.http.get<PartsResponse>(`${buildPath(buildId)}/parts`, { params }).pipe(map((response) => response.parts));
  }

  create(buildId: string, request: CreatePartRequest): Observable<PartDto> {
    return this.http.post<PartDto>(`${buildPath(buildId)}/parts`, request);
  }

  /** A 409 carries the saved part (error.current); the caller shows what changed, so no snack bar. */
  update(buildId: string, partId: string, request: UpdatePartRequest): Observable<PartDto> {
    return this.http.patch<PartDto>(`${buildPath(buildId)}/parts/${encodeURIComponent(partId)}`, request, {
      context: new HttpContext().set(HANDLED_STATUSES, [409]),
    });
  }

  remove(buildId: string, partId: string): Observable<void> {
    return this.http.delete<void>(`${buildPath(buildId)}/parts/${encodeURIComponent(partId)}`);
  }

  bulk(buildId: string, request: BulkPartsRequest): Observable<PartDto[]> {
    return this.http.post<PartsResponse>(`${buildPath(buildId)}/parts/bulk`, request).pipe(map((response) => response.parts));
  }

  /** Reads the CSV and answers what each row would become; nothing is saved. Problems with the file itself are field "file". */
  previewImport(buildId: string, file: File): Observable<ImportPreviewDto> {
    return this.http.post<ImportPreviewDto>(`${buildPath(buildId)}/parts/import`, csvForm(file));
  }

  /** Saves the rows; with rejected rows the API answers 400 unless they are dropped. */
  commitImport(buildId: string, file: File, dropRejected: boolean): Observable<ImportResultDto> {
    let params = new HttpParams().set('commit', 'true');
    if (dropRejected) params = params.set('dropRejected', 'true');
    return this.http.post<ImportResultDto>(`${buildPath(buildId)}/parts/import`, csvForm(file), { params });
  }
}

function csvForm(file: File): FormData {
  const form = new FormData();
  form.append('file', file, file.name);
  return form;
}
