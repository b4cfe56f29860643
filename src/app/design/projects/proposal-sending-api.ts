import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type {
  ClientLinkList,
  ClientLinkRequest,
  CreatedClientLink,
  ProjectClient,
  ProjectClientInput,
  ProposalMail,
  ProposalMailList,
  ProposalMailRequest,
} from '../../../../shared/api/api-schemas';
import { problemShownByCaller } from '../../core/problem-details-interceptor';

/** A project's client, the proposals e-mailed to them and their read-only links, one method per endpoint. */
@Injectable({ providedIn: 'root' })
export class ProposalSendingApi {
  private readonly http = inject(HttpClient);

  updateClient(projectId: number, client: ProjectClientInput): Observable<ProjectClient> {
    return this.http.put<ProjectClient>(`/api/v1/projects/${projectId}/client`, client, problemShownByCaller());
  }

  sendProposal(projectId: number, mail: ProposalMailRequest): Observable<ProposalMail> {
    return this.http.post<ProposalMail>(`/api/v1/projects/${projectId}/proposal-mails`, mail, problemShownByCaller());
  }

  listProposalMails(projectId: number): Observable<ProposalMailList> {
    return this.http.get<ProposalMailList>(`/api/v1/projects/${projectId}/proposal-mails`);
  }

  createClientLink(projectId: number, link: ClientLinkRequest): Observable<CreatedClientLink> {
    return this.http.post<CreatedClientLink>(
      `/api/v1/projects/${projectId}/client-links`,
      link,
      problemShownByCaller(),
    );
  }

  listClientLinks(projectId: number): Observable<ClientLinkList> {
    return this.http.get<ClientLinkList>(`/api/v1/projects/${projectId}/client-links`);
  }

  revokeClientLink(projectId: number, linkId: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/projects/${projectId}/client-links/${linkId}`);
  }
}
