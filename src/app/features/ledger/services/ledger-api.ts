// Calls for a build's ledger: the figures per system, spend over time, spend by vendor and the lines behind a figure.
import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { LedgerDto, LedgerLinesQuery, LedgerLinesResponse, SpendPeriod, SpendResponse, VendorsResponse } from '../../../../../shared/api/ledger';

const ledgerPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}/ledger`;

@Injectable({ providedIn: 'root' })
export class LedgerApi {
  private readonly http = inject(HttpClient);

  ledger(buildId: string): Observable<LedgerDto> {
    return this.http.get<LedgerDto>(ledgerPath(buildId));
  }

  spend(buildId: string, by: SpendPeriod): Observable<SpendResponse> {
    return this.http.get<SpendResponse>(`${ledgerPath(buildId)}/spend`, { params: new HttpParams().set('by', by) });
  }

  vendors(buildId: string): Observable<VendorsResponse> {
    return this.http.get<VendorsResponse>(`${ledgerPath(buildId)}/vendors`);
  }

  /** The receipt lines a figure counts, narrowed to a system, a shop or a period when given. */
  lines(buildId: string, query: LedgerLinesQuery): Observable<LedgerLinesResponse> {
    let params = new HttpParams().set('figure', query.figure);
    for (const key of ['systemId', 'vendorId', 'period'] as const) {
      const value = query[key];
      if (value) params = params.set(key, value);
    }
    return this.http.get<LedgerLinesResponse>(`${ledgerPath(buildId)}/lines`, { params });
  }
}
