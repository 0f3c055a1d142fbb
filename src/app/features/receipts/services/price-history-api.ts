// Calls for a build's price history: every price paid for an item seen on filed receipts, by shop and date.
import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { PriceHistoryResponse } from '../../../../../shared/api/price-history';

@Injectable({ providedIn: 'root' })
export class PriceHistoryApi {
  private readonly http = inject(HttpClient);

  /** Items seen on two filed receipts or more; with `minReceipts` 1, every item filed before (for the check screen). */
  priceHistory(buildId: string, minReceipts: 1 | 2 = 2): Observable<PriceHistoryResponse> {
    const params = minReceipts === 2 ? undefined : new HttpParams().set('minReceipts', minReceipts);
    return this.http.get<PriceHistoryResponse>(`/api/builds/${encodeURIComponent(buildId)}/price-history`, { params });
  }
}
