import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, effect, inject, signal, untracked } from '@angular/core';
import type { Subscription } from 'rxjs';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { ReportPaper, ReportSummary } from '../../../../shared/api/api-schemas';
import { describeHttpError } from '../../core/problem-details';
import { ReportsApi } from '../../profile/reports-api';
import { attachmentFileName, saveFile } from '../../shared/file-download';
import { SelectionDraft } from '../selection-draft';
import { DecimalInput } from '../../shared/locale-numbers';

/**
 * The proposal as a PDF made on the server from the saved project, the stored ones to download
 * again, and the crew's parts list as CSV. A design not saved as a project has none of these.
 */
@Component({
  selector: 'rf-report-documents',
  imports: [
    DecimalInput,
    DatePipe,
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  template: `
    <section class="rf-card rf-no-print" aria-labelledby="rf-report-documents">
      <h2 id="rf-report-documents">Proposal PDF and parts list</h2>
      @if (draft.project(); as project) {
        <p class="rf-muted">
          Made on the server from the saved project "{{ project.name }}", headed by your
          <a routerLink="/account/profile">company profile</a>. Save the project first if you changed the design.
        </p>
        <div class="rf-report-documents-form">
          <mat-button-toggle-group [(ngModel)]="paper" aria-label="Paper">
            <mat-button-toggle value="letter">US Letter</mat-button-toggle>
            <mat-button-toggle value="a4">A4</mat-button-toggle>
          </mat-button-toggle-group>
          <mat-form-field appearance="outline">
            <mat-label>Client</mat-label>
            <input matInput [(ngModel)]="clientName" maxlength="200" />
          </mat-form-field>
          <mat-form-field appearance="outline">
            <mat-label>Site</mat-label>
            <input matInput [(ngModel)]="siteAddress" maxlength="200" />
          </mat-form-field>
          <mat-form-field appearance="outline">
            <mat-label>Pipe allowance (%)</mat-label>
            <input matInput type="number" min="0" max="100" [(ngModel)]="allowance" />
          </mat-form-field>
        </div>
        <div class="rf-report-documents-actions">
          <button mat-flat-button type="button" (click)="makePdf(project.id)" [disabled]="busy() || making()">
            <mat-icon>picture_as_pdf</mat-icon> Make PDF
          </button>
          @if (making()) {
            <button mat-stroked-button type="button" (click)="cancelPdf(project.id)">
              <mat-icon>close</mat-icon> Cancel PDF
            </button>
          } @else {
            <button mat-stroked-button type="button" (click)="partsList(project.id)" [disabled]="busy()">
              <mat-icon>list_alt</mat-icon> Parts list (CSV)
            </button>
          }
        </div>
        <div role="status">
          @if (making()) {
            <mat-progress-bar mode="indeterminate" aria-label="Making the PDF" />
            <p class="rf-muted">
              Making the PDF: working out the figures for the saved design and laying out the pages. It is stored with
              the project and downloads when it is ready.
            </p>
          } @else if (cancelled()) {
            <p class="rf-muted">
              PDF cancelled: nothing is stored. Had it been stored just before you cancelled, it is in the list below.
            </p>
          }
        </div>
        @if (problem(); as message) {
          <p class="rf-report-documents-problem" role="alert">{{ message }}</p>
        }
        @if (reports().length > 0) {
          <ul class="rf-report-documents-list" aria-label="Stored proposals">
            @for (report of reports(); track report.id) {
              <li>
                <button mat-button type="button" (click)="download(report)">
                  <mat-icon>download</mat-icon> Proposal {{ report.id }} ({{ report.paper === 'a4' ? 'A4' : 'Letter' }},
                  {{ report.createdAt | date: 'medium' }})
                </button>
                <code class="rf-muted" title="sha-256">{{ report.sha256.slice(0, 12) }}</code>
              </li>
            }
          </ul>
        } @else if (listed()) {
          <p class="rf-muted" data-no-proposals>
            No proposal of this project is stored yet. Check the client, the site and the paper above, then choose Make
            PDF: each one made is kept here to download again.
          </p>
        }
      } @else {
        <p class="rf-muted">Save the design as a project to make its proposal PDF and parts list.</p>
      }
    </section>
  `,
  // the design pages' card and muted text, as the report page around it uses them
  styleUrls: ['../design-page.scss'],
  styles: `
    .rf-report-documents-form {
      display: flex;
      flex-wrap: wrap;
      gap: 0.75rem;
      align-items: center;
    }
    .rf-report-documents-actions {
      display: flex;
      gap: 0.75rem;
      margin-bottom: 0.75rem;
    }
    .rf-report-documents-problem {
      color: var(--mat-sys-error);
    }
    .rf-report-documents-list {
      list-style: none;
      padding: 0;
      li {
        display: flex;
        gap: 0.5rem;
        align-items: center;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportDocuments {
  protected readonly draft = inject(SelectionDraft);
  private readonly api = inject(ReportsApi);
  protected paper: ReportPaper = this.draft.unitSystem() === 'si' ? 'a4' : 'letter';
  protected clientName = '';
  protected siteAddress = '';
  protected allowance = 10;
  protected readonly reports = signal<ReportSummary[]>([]);
  /** Whether the stored proposals have been listed, so the empty list is not announced before. */
  protected readonly listed = signal(false);
  protected readonly busy = signal(false);
  protected readonly making = signal(false);
  protected readonly cancelled = signal(false);
  protected readonly problem = signal<string | null>(null);
  // only the Cancel button stops it: leaving the step lets the PDF be made and stored as before
  private pendingPdf: Subscription | null = null;

  constructor() {
    effect(() => {
      const project = this.draft.project();
      if (project) untracked(() => this.listReports(project.id));
    });
  }

  private listReports(projectId: number): void {
    this.api.listReports(projectId).subscribe((list) => {
      this.reports.set(list.reports);
      this.listed.set(true);
    });
  }

  private failed(error: HttpErrorResponse): void {
    this.busy.set(false);
    this.problem.set(describeHttpError(error));
  }

  protected makePdf(projectId: number): void {
    this.making.set(true);
    this.cancelled.set(false);
    this.problem.set(null);
    this.pendingPdf = this.api
      .createReport(projectId, {
        paper: this.paper,
        clientName: this.clientName,
        siteAddress: this.siteAddress,
        wasteAllowancePercent: this.allowance,
      })
      .subscribe({
        next: (report) => {
          this.making.set(false);
          this.reports.update((reports) => [report, ...reports]);
          this.download(report);
        },
        error: (error: HttpErrorResponse) => {
          this.making.set(false);
          this.failed(error);
        },
      });
  }

  /**
   * Stops waiting for the PDF: the request is aborted, and the server keeps nothing it had not yet
   * stored. The list is asked again, for a proposal stored in the instant before the cancel.
   */
  protected cancelPdf(projectId: number): void {
    this.pendingPdf?.unsubscribe();
    this.pendingPdf = null;
    this.making.set(false);
    this.cancelled.set(true);
    this.listReports(projectId);
  }

  protected download(report: ReportSummary): void {
    this.busy.set(true);
    this.api.downloadReport(report.downloadPath).subscribe({
      next: (response) => {
        this.busy.set(false);
        const name = attachmentFileName(response.headers.get('Content-Disposition'), `proposal-${report.id}.pdf`);
        saveFile(response.body!, name);
      },
      error: (error: HttpErrorResponse) => this.failed(error),
    });
  }

  protected partsList(projectId: number): void {
    this.busy.set(true);
    this.problem.set(null);
    this.api.downloadPartsList(projectId, this.allowance).subscribe({
      next: (response) => {
        this.busy.set(false);
        saveFile(response.body!, attachmentFileName(response.headers.get('Content-Disposition'), 'parts-list.csv'));
      },
      error: (error: HttpErrorResponse) => this.failed(error),
    });
  }
}
