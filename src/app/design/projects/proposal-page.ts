import { Clipboard } from '@angular/cdk/clipboard';
import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import type {
  ClientLink,
  ClientLinkState,
  CreatedClientLink,
  Project,
  ProposalMail,
  ReportSummary,
} from '../../../../shared/api/api-schemas';
import { describeHttpError } from '../../core/problem-details';
import { SessionService } from '../../core/session-service';
import { ReportsApi } from '../../profile/reports-api';
import { ProjectsApi } from './projects-api';
import { ProposalSendingApi } from './proposal-sending-api';
import { DecimalInput } from '../../shared/locale-numbers';

/**
 * Sending one project's proposal: the client and site, a stored proposal (or a new one) e-mailed
 * with the designer's message, the send log, and read-only client links with their state and views.
 */
@Component({
  selector: 'rf-proposal-page',
  imports: [
    DecimalInput,
    DatePipe,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    RouterLink,
  ],
  templateUrl: './proposal-page.html',
  styleUrls: ['../design-page.scss'],
  styles: `
    .rf-fields {
      display: flex;
      flex-wrap: wrap;
      gap: 0 0.75rem;
      align-items: flex-start;
    }
    .rf-wide {
      flex: 1 1 100%;
    }
    .rf-buttons {
      display: flex;
      gap: 0.75rem;
      margin-bottom: 0.75rem;
    }
    .rf-table {
      width: 100%;
      border-collapse: collapse;
      th,
      td {
        padding: 0.4rem 0.5rem;
        border-bottom: 1px solid #e4ddd0;
        text-align: left;
        vertical-align: top;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposalPage {
  private readonly projectsApi = inject(ProjectsApi);
  private readonly reportsApi = inject(ReportsApi);
  private readonly api = inject(ProposalSendingApi);
  private readonly session = inject(SessionService);
  private readonly clipboard = inject(Clipboard);
  protected readonly projectId = Number(inject(ActivatedRoute).snapshot.paramMap.get('projectId'));
  protected readonly stateWords: Record<ClientLinkState, string> = {
    active: 'Open',
    expired: 'Expired',
    revoked: 'Revoked',
  };

  protected readonly project = signal<Project | null>(null);
  protected readonly reports = signal<ReportSummary[]>([]);
  protected readonly mails = signal<ProposalMail[]>([]);
  protected readonly links = signal<ClientLink[]>([]);
  protected readonly newLink = signal<CreatedClientLink | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly clientNote = signal<string | null>(null);
  protected readonly sendNote = signal<string | null>(null);
  protected readonly copied = signal(false);

  protected clientName = '';
  protected clientEmail = '';
  protected clientPhone = '';
  protected siteAddress = '';
  protected reportId: number | null = null;
  protected message = '';
  protected expiresInDays = 30;

  constructor() {
    this.projectsApi.getProject(this.projectId).subscribe(({ project }) => {
      this.project.set(project);
      this.clientName = project.client.clientName ?? '';
      this.clientEmail = project.client.clientEmail ?? '';
      this.clientPhone = project.client.clientPhone ?? '';
      this.siteAddress = project.client.siteAddress ?? '';
      this.message = this.defaultMessage(project);
    });
    this.reportsApi.listReports(this.projectId).subscribe(({ reports }) => {
      this.reports.set(reports);
      this.reportId ??= reports[0]?.id ?? null;
    });
    this.reloadMails();
    this.reloadLinks();
  }

  private defaultMessage(project: Project): string {
    const greeting = project.client.clientName ? `Dear ${project.client.clientName},` : 'Hello,';
    const sender = this.session.user()?.name ?? '';
    return [greeting, '', `Please find attached the pump proposal for ${project.name}.`, '', 'Kind regards,', sender]
      .join('\n')
      .trim();
  }

  private failed(error: HttpErrorResponse): void {
    this.busy.set(false);
    this.problem.set(describeHttpError(error));
  }

  private start(): void {
    this.busy.set(true);
    this.problem.set(null);
    this.clientNote.set(null);
    this.sendNote.set(null);
  }

  protected saveClient(): void {
    this.start();
    this.api
      .updateClient(this.projectId, {
        clientName: this.clientName,
        clientEmail: this.clientEmail,
        ...(this.clientPhone.trim() ? { clientPhone: this.clientPhone } : {}),
        ...(this.siteAddress.trim() ? { siteAddress: this.siteAddress } : {}),
      })
      .subscribe({
        next: (client) => {
          this.busy.set(false);
          this.project.update((project) => (project ? { ...project, client } : project));
          this.clientNote.set('The client and site are saved.');
        },
        error: (error: HttpErrorResponse) => this.failed(error),
      });
  }

  protected makeProposal(): void {
    this.start();
    const paper = this.project()?.design.unitSystem === 'si' ? 'a4' : 'letter';
    this.reportsApi.createReport(this.projectId, { paper }).subscribe({
      next: (report) => {
        this.busy.set(false);
        this.reports.update((reports) => [report, ...reports]);
        this.reportId = report.id;
        this.sendNote.set(`Proposal ${report.id} is made and stored.`);
      },
      error: (error: HttpErrorResponse) => this.failed(error),
    });
  }

  protected send(): void {
    if (this.reportId === null) return;
    this.start();
    this.api.sendProposal(this.projectId, { reportId: this.reportId, message: this.message }).subscribe({
      next: (mail) => {
        this.busy.set(false);
        this.mails.update((mails) => [mail, ...mails]);
        this.sendNote.set(`Sent to ${mail.to}: "${mail.subject}" with ${mail.attachment?.filename ?? 'the PDF'}.`);
      },
      error: (error: HttpErrorResponse) => this.failed(error),
    });
  }

  protected makeLink(): void {
    if (this.reportId === null) return;
    this.start();
    this.copied.set(false);
    this.api
      .createClientLink(this.projectId, { reportId: this.reportId, expiresInDays: this.expiresInDays })
      .subscribe({
        next: (link) => {
          this.busy.set(false);
          this.newLink.set(link);
          this.reloadLinks();
        },
        error: (error: HttpErrorResponse) => this.failed(error),
      });
  }

  protected copy(url: string): void {
    this.copied.set(this.clipboard.copy(url));
  }

  protected revoke(linkId: number): void {
    this.api.revokeClientLink(this.projectId, linkId).subscribe(() => this.reloadLinks());
  }

  private reloadMails(): void {
    this.api.listProposalMails(this.projectId).subscribe(({ mails }) => this.mails.set(mails));
  }

  private reloadLinks(): void {
    this.api.listClientLinks(this.projectId).subscribe(({ links }) => this.links.set(links));
  }
}
