// Calls for a build's receipts: upload with progress, list, check (header, lines, split, merge), file, reopen, line search, cores and returns.
import { HttpClient, HttpContext, HttpEvent, HttpEventType, HttpHeaders, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, map } from 'rxjs';
import type {
  CoreDto,
  CreateLineRequest,
  FileReceiptRequest,
  LineSearchResultDto,
  ReceiptDto,
  ReceiptLineDto,
  ReceiptSummaryDto,
  ReturnsDto,
  SplitLineRequest,
  UpdateCoreRequest,
  UpdateLineRequest,
  UpdateReceiptRequest,
} from '../../../../../shared/api/receipts';
import type { AcceptSuggestionsRequest, ReceiptSuggestionsDto } from '../../../../../shared/api/suggestions';
import type { ReceiptState, ReviewState } from '../../../../../shared/enums';
import { HANDLED_STATUSES } from '../../../core/http/api-error';
import type { NotDuplicateRequest } from '../../../../../shared/api/review';

const buildPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}`;
const receiptPath = (buildId: string, receiptId: string) => `${buildPath(buildId)}/receipts/${encodeURIComponent(receiptId)}`;
/** The page shows field and version problems itself (next to the file, the field, or as "reload"). */
const handled = (statuses: number[]) => ({ context: new HttpContext().set(HANDLED_STATUSES, statuses) });
/** A queued capture's failures show on its own chip (waiting, or not sent with the reason), never as a snack bar. */
const CAPTURE_HANDLED_STATUSES = [0, 400, 403, 404, 408, 409, 413, 415, 422, 425, 429, 500, 502, 503, 504];

export interface ReceiptsFilter {
  state?: ReceiptState;
  vendor?: string;
  from?: string;
  to?: string;
  systemId?: string;
  /** The partner's review state: none, approved, questioned or answered. */
  review?: ReviewState;
}

/** One upload's progress (0..100) while it is sent, then the receipts the server made of it. */
export type UploadProgress = { kind: 'progress'; percent: number } | { kind: 'done'; receipts: ReceiptDto[] };

@Injectable({ providedIn: 'root' })
export class ReceiptsApi {
  private readonly http = inject(HttpClient);

  /**
   * Sends files as the multipart field "files"; a refused file answers 400 with fields `files.N`, shown by the page.
   * A capture from the camera carries its client-made id as the Idempotency-Key (a structured-field string, as the
   * IETF draft sends it), so sending it again answers the receipt already made; its queue shows every failure itself.
   */
  upload(buildId: string, files: readonly File[], idempotencyKey?: string): Observable<UploadProgress> {
    const form = new FormData();
    for (const file of files) form.append('files', file, file.name);
    const capture = idempotencyKey === undefined ? {} : {
      // ngsw-bypass: the upload goes straight to the network, not through the service worker, so its progress is real.
      headers: new HttpHeaders({ 'Idempotency-Key': `"${idempotencyKey}"`, 'ngsw-bypass': 'true' }),
      ...handled(CAPTURE_HANDLED_STATUSES),
    };
    return this.http
      .post<{ receipts: ReceiptDto[] }>(`${buildPath(buildId)}/receipts`, form, { reportProgress: true, observe: 'events', ...handled([400]), ...capture })
      .pipe(
        map((event: HttpEvent<{ receipts: ReceiptDto[] }>): UploadProgress | null => {
          if (event.type === HttpEventType.UploadProgress) {
            // Without a total the browser cannot say how far it got; show the bar as just started.
            const percent = event.total ? Math.min(100, Math.round((100 * event.loaded) / event.total)) : 0;
            return { kind: 'progress', percent };
          }
          if (event.type === HttpEventType.Response) return { kind: 'done', receipts: event.body?.receipts ?? [] };
          return null;
        }),
        filter((progress): progress is UploadProgress => progress !== null),
      );
  }

  list(buildId: string, filter: ReceiptsFilter = {}): Observable<ReceiptSummaryDto[]> {
    let params = new HttpParams();
    for (const key of ['state', 'vendor', 'from', 'to', 'systemId', 'review'] as const) {
      const value = filter[key]?.trim();
      if (value) params = params.set(key, value);
    }
    return this.http.get<{ receipts: ReceiptSummaryDto[] }>(`${buildPath(buildId)}/receipts`, { params }).pipe(map((response) => response.receipts));
  }

  get(buildId: string, receiptId: string): Observable<ReceiptDto> {
    return this.http.get<ReceiptDto>(receiptPath(buildId, receiptId));
  }

  /** The image the line boxes refer to. */
  pageUrl(buildId: string, receiptId: string, index: number): string {
    return `${receiptPath(buildId, receiptId)}/pages/${index}`;
  }

  documentUrl(buildId: string, receiptId: string): string {
    return `${receiptPath(buildId, receiptId)}/document`;
  }

  update(buildId: string, receiptId: string, request: UpdateReceiptRequest): Observable<ReceiptDto> {
    return this.http.patch<ReceiptDto>(receiptPath(buildId, receiptId), request, handled([400, 409]));
  }

  addLine(buildId: string, receiptId: string, request: CreateLineRequest): Observable<ReceiptLineDto> {
    return this.http.post<ReceiptLineDto>(`${receiptPath(buildId, receiptId)}/lines`, request, handled([400]));
  }

  updateLine(buildId: string, receiptId: string, lineId: string, request: UpdateLineRequest): Observable<ReceiptLineDto> {
    return this.http.patch<ReceiptLineDto>(`${receiptPath(buildId, receiptId)}/lines/${encodeURIComponent(lineId)}`, request, handled([400, 409]));
  }

  removeLine(buildId: string, receiptId: string, lineId: string): Observable<void> {
    return this.http.delete<void>(`${receiptPath(buildId, receiptId)}/lines/${encodeURIComponent(lineId)}`);
  }

  splitLine(buildId: string, receiptId: string, lineId: string, request: SplitLineRequest): Observable<ReceiptDto> {
    return this.http.post<ReceiptDto>(`${receiptPath(buildId, receiptId)}/lines/${encodeURIComponent(lineId)}/split`, request, handled([400, 409]));
  }

  mergeLines(buildId: string, receiptId: string, lineIds: string[]): Observable<ReceiptDto> {
    return this.http.post<ReceiptDto>(`${receiptPath(buildId, receiptId)}/lines/merge`, { lineIds });
  }

  /** A 400 names `total` (does not reconcile), `purchaseDate` or `lines.N.systemId`; the page shows them beside the button. */
  file(buildId: string, receiptId: string, request: FileReceiptRequest): Observable<ReceiptDto> {
    return this.http.post<ReceiptDto>(`${receiptPath(buildId, receiptId)}/file`, request, handled([400, 409]));
  }

  reopen(buildId: string, receiptId: string): Observable<ReceiptDto> {
    return this.http.post<ReceiptDto>(`${receiptPath(buildId, receiptId)}/reopen`, {});
  }

  /** Says a likely duplicate is a separate purchase; answers the receipt as saved (its warning gone for that pair). */
  notDuplicate(buildId: string, receiptId: string, request: NotDuplicateRequest): Observable<ReceiptDto> {
    return this.http.post<ReceiptDto>(`${receiptPath(buildId, receiptId)}/not-duplicate`, request, handled([400]));
  }

  /** The reader's proposals for every line that takes a part or a system, best first, with reasons. */
  suggestions(buildId: string, receiptId: string): Observable<ReceiptSuggestionsDto> {
    return this.http.get<ReceiptSuggestionsDto>(`${receiptPath(buildId, receiptId)}/suggestions`);
  }

  /** Takes the top suggestion of every unassigned line (or the named ones) that reaches the threshold. */
  acceptSuggestions(buildId: string, receiptId: string, request: AcceptSuggestionsRequest = {}): Observable<ReceiptDto> {
    return this.http.post<ReceiptDto>(`${receiptPath(buildId, receiptId)}/suggestions/accept`, request, handled([400, 409]));
  }

  /** Lines of other receipts matching the text, to link a return to the line it returns. */
  searchLines(buildId: string, text: string, excludeReceiptId?: string): Observable<LineSearchResultDto[]> {
    let params = new HttpParams().set('q', text);
    if (excludeReceiptId) params = params.set('excludeReceiptId', excludeReceiptId);
    return this.http
      .get<{ lines: LineSearchResultDto[] }>(`${buildPath(buildId)}/receipt-lines`, { params, ...handled([400]) })
      .pipe(map((response) => response.lines));
  }

  cores(buildId: string): Observable<CoreDto[]> {
    return this.http.get<{ cores: CoreDto[] }>(`${buildPath(buildId)}/cores`).pipe(map((response) => response.cores));
  }

  updateCore(buildId: string, coreId: string, request: UpdateCoreRequest): Observable<CoreDto> {
    return this.http.patch<CoreDto>(`${buildPath(buildId)}/cores/${encodeURIComponent(coreId)}`, request);
  }

  /** Part lines that can still go back, those sent back awaiting a refund, and those refunded. */
  returns(buildId: string): Observable<ReturnsDto> {
    return this.http.get<ReturnsDto>(`${buildPath(buildId)}/returns`);
  }
}
