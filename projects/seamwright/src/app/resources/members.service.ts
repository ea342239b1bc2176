import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';
import { API } from '../core/api-paths';
import type { AcceptInvitationBody, Invitation, InvitationBody, InvitationPreview, MemberAccess, MemberAccessBody, MembersResponse, PatternSummary } from '../core/api-types';

/** Sharing: members of a pattern, invitations by e-mail, accepting one. */
@Injectable({ providedIn: 'root' })
export class MembersService {
  private readonly http = inject(HttpClient);

  list(patternId: string): Observable<MembersResponse> {
    return this.http.get<MembersResponse>(API.members(patternId));
  }

  invite(patternId: string, email: string, access: MemberAccess): Observable<Invitation> {
    return this.http.post<{ invitation: Invitation }>(API.invitations(patternId), { email, access } satisfies InvitationBody).pipe(map((r) => r.invitation));
  }

  changeAccess(patternId: string, userId: string, access: MemberAccess): Observable<unknown> {
    return this.http.patch(API.member(patternId, userId), { access } satisfies MemberAccessBody);
  }

  /** Removes a member (the owner revoking, or the member leaving). */
  revoke(patternId: string, userId: string): Observable<unknown> {
    return this.http.delete(API.member(patternId, userId));
  }

  withdrawInvitation(patternId: string, invitationId: string): Observable<unknown> {
    return this.http.delete(API.invitation(patternId, invitationId));
  }

  preview(token: string): Observable<InvitationPreview> {
    return this.http.get<{ invitation: InvitationPreview }>(API.invitationByToken(token)).pipe(map((r) => r.invitation));
  }

  accept(token: string): Observable<PatternSummary> {
    return this.http.post<{ pattern: PatternSummary }>(API.acceptInvitation, { token } satisfies AcceptInvitationBody).pipe(map((r) => r.pattern));
  }
}
