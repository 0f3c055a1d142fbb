// Calls of the partner's review: the queue, a verdict, the comment thread and the audit trail of a receipt.
import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import type { ReceiptSummaryDto } from '../../../../../shared/api/receipts';
import type { AuditEventDto, CommentDto, ReviewRequest } from '../../../../../shared/api/review';
import type { ReviewState } from '../../../../../shared/enums';
import { HANDLED_STATUSES } from '../../../core/http/api-error';

const receiptPath = (buildId: string, receiptId: string) => `/api/builds/${encodeURIComponent(buildId)}/receipts/${encodeURIComponent(receiptId)}`;
/** The page shows these itself: a missing comment beside the field, a stale version as "reloaded". */
const handled = (statuses: number[]) => ({ context: new HttpContext().set(HANDLED_STATUSES, statuses) });

export interface ReviewResult {
  reviewState: ReviewState;
  reviewComment: string;
  version: number;
}

@Injectable({ providedIn: 'root' })
export class ReviewApi {
  private readonly http = inject(HttpClient);

  /** Filed receipts nobody has approved or questioned yet. */
  queue(buildId: string): Observable<ReceiptSummaryDto[]> {
    return this.http.get<{ receipts: ReceiptSummaryDto[] }>(`/api/builds/${encodeURIComponent(buildId)}/review-queue`).pipe(map((response) => response.receipts));
  }

  review(buildId: string, receiptId: string, request: ReviewRequest): Observable<ReviewResult> {
    return this.http.post<ReviewResult>(`${receiptPath(buildId, receiptId)}/review`, request, handled([400, 409]));
  }

  comments(buildId: string, receiptId: string): Observable<CommentDto[]> {
    return this.http.get<{ comments: CommentDto[] }>(`${receiptPath(buildId, receiptId)}/comments`).pipe(map((response) => response.comments));
  }

  addComment(buildId: string, receiptId: string, body: string): Observable<CommentDto> {
    return this.http.post<CommentDto>(`${receiptPath(buildId, receiptId)}/comments`, { body }, handled([400]));
  }

  audit(buildId: string, receiptId: string): Observable<AuditEventDto[]> {
    return this.http.get<{ events: AuditEventDto[] }>(`${receiptPath(buildId, receiptId)}/audit`).pipe(map((response) => response.events));
  }
}
