// Calls for a build's crew: members, invites, roles, leaving, and the public invite link.
import { HttpClient, HttpContext } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  ChangeRoleRequest,
  InviteDto,
  InvitePreviewDto,
  InviteRequest,
  MemberDto,
  MembersResponse,
} from '../../../../../shared/api/builds';
import { HANDLED_STATUSES } from '../../../core/http/api-error';

const buildPath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}`;

@Injectable({ providedIn: 'root' })
export class CrewApi {
  private readonly http = inject(HttpClient);

  members(buildId: string): Observable<MembersResponse> {
    return this.http.get<MembersResponse>(`${buildPath(buildId)}/members`);
  }

  invite(buildId: string, request: InviteRequest): Observable<InviteDto> {
    return this.http.post<InviteDto>(`${buildPath(buildId)}/invites`, request);
  }

  withdrawInvite(buildId: string, inviteId: string): Observable<void> {
    return this.http.delete<void>(`${buildPath(buildId)}/invites/${encodeURIComponent(inviteId)}`);
  }

  changeRole(buildId: string, userId: string, request: ChangeRoleRequest): Observable<MemberDto> {
    return this.http.patch<MemberDto>(`${buildPath(buildId)}/members/${encodeURIComponent(userId)}`, request);
  }

  /** The owner removing someone, or a member removing themself (leaving). */
  removeMember(buildId: string, userId: string): Observable<void> {
    return this.http.delete<void>(`${buildPath(buildId)}/members/${encodeURIComponent(userId)}`);
  }

  /** What an invite link offers; 404 when it is unknown, expired or used, which the page explains. */
  previewInvite(token: string): Observable<InvitePreviewDto> {
    return this.http.get<InvitePreviewDto>(`/api/invites/${encodeURIComponent(token)}`, {
      context: new HttpContext().set(HANDLED_STATUSES, [404]),
    });
  }

  acceptInvite(token: string): Observable<{ buildId: string }> {
    return this.http.post<{ buildId: string }>(`/api/invites/${encodeURIComponent(token)}/accept`, null);
  }
}
