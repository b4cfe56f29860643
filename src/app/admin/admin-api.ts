import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';
import type {
  AdminUser,
  AdminUserList,
  AuditEventList,
  DemoMailbox,
  InvitationList,
  InvitationSummary,
  NewInvitation,
  UserChanges,
} from '../../../shared/api/api-schemas';
import { problemShownByCaller } from '../core/problem-details-interceptor';

/** Site-admin endpoints: one method per endpoint. */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  listUsers(): Observable<AdminUserList> {
    return this.http.get<AdminUserList>('/api/v1/admin/users');
  }

  updateUser(userId: number, changes: UserChanges): Observable<AdminUser> {
    return this.http.patch<AdminUser>(`/api/v1/admin/users/${userId}`, changes, problemShownByCaller());
  }

  listInvitations(): Observable<InvitationList> {
    return this.http.get<InvitationList>('/api/v1/admin/invitations');
  }

  inviteUser(invitation: NewInvitation): Observable<InvitationSummary> {
    return this.http.post<InvitationSummary>('/api/v1/admin/invitations', invitation, problemShownByCaller());
  }

  listAuditEvents(limit = 200): Observable<AuditEventList> {
    return this.http.get<AuditEventList>('/api/v1/admin/audit-events', { params: { limit } });
  }

  listDemoMail(): Observable<DemoMailbox> {
    return this.http.get<DemoMailbox>('/api/v1/admin/demo-mailbox');
  }
}
