// Calls for a build's inbox: its address, a new address, and the mail it did not add.
import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type { InboxDto, MailRefusalDto } from '../../../../../shared/api/inbox';

const inboxPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}/inbox`;

@Injectable({ providedIn: 'root' })
export class InboxApi {
  private readonly http = inject(HttpClient);

  inbox(buildId: string): Observable<InboxDto> {
    return this.http.get<InboxDto>(inboxPath(buildId));
  }

  /** A new address; the old one stops taking mail at once. */
  rotate(buildId: string): Observable<InboxDto> {
    return this.http.post<InboxDto>(`${inboxPath(buildId)}/rotate`, {});
  }

  /** The owner's list of mail that was not added, newest first. */
  refused(buildId: string): Observable<{ refused: MailRefusalDto[] }> {
    return this.http.get<{ refused: MailRefusalDto[] }>(`${inboxPath(buildId)}/refused`);
  }
}
