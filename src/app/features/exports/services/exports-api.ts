// Calls of the exports: the CSVs and the ZIP as files with download progress, and the build sheet's data for print.
import { HttpClient, HttpContext, HttpEventType, HttpParams, HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, map } from 'rxjs';
import type { BuildSheetDto } from '../../../../../shared/api/exports';
import { HANDLED_STATUSES } from '../../../core/http/api-error';

export type ExportFile = 'tax-ledger.csv' | 'build-sheet.csv' | 'archive.zip';

export interface ExportFilter {
  from?: string | null;
  to?: string | null;
  systemId?: string | null;
}

/** A download's progress: bytes so far (and the size when the server knows it), then the file itself. */
export type DownloadProgress = { kind: 'progress'; loaded: number; total: number | null } | { kind: 'done'; blob: Blob; fileName: string };

/** The page says what went wrong and what to do, so no snack bar as well. */
const handledHere = { context: new HttpContext().set(HANDLED_STATUSES, [0, 400, 403, 404, 500, 502, 503]) };

const exportsPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}/exports`;

function paramsOf(filterValues: ExportFilter): HttpParams {
  let params = new HttpParams();
  for (const key of ['from', 'to', 'systemId'] as const) {
    const value = filterValues[key];
    if (value) params = params.set(key, value);
  }
  return params;
}

/** The name the server gives in Content-Disposition, else the export's own name. */
export function fileNameOf(response: HttpResponse<unknown>, fallback: string): string {
  const disposition = response.headers.get('Content-Disposition') ?? '';
  return /filename="([^"]+)"/.exec(disposition)?.[1] ?? fallback;
}

@Injectable({ providedIn: 'root' })
export class ExportsApi {
  private readonly http = inject(HttpClient);

  download(buildId: string, file: ExportFile, filterValues: ExportFilter = {}): Observable<DownloadProgress> {
    // The archive is the whole build for an accountant: filters do not apply to it.
    const params = file === 'archive.zip' ? new HttpParams() : paramsOf(filterValues);
    return this.http.get(`${exportsPath(buildId)}/${file}`, { params, responseType: 'blob', reportProgress: true, observe: 'events', ...handledHere }).pipe(
      map((event): DownloadProgress | null => {
        if (event.type === HttpEventType.DownloadProgress) return { kind: 'progress', loaded: event.loaded, total: event.total ?? null };
        if (event.type === HttpEventType.Response) return { kind: 'done', blob: event.body ?? new Blob([]), fileName: fileNameOf(event, file) };
        return null;
      }),
      filter((progress): progress is DownloadProgress => progress !== null),
    );
  }

  buildSheet(buildId: string, systemId?: string | null): Observable<BuildSheetDto> {
    return this.http.get<BuildSheetDto>(`${exportsPath(buildId)}/build-sheet`, { params: paramsOf({ systemId }) });
  }
}
