import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatTableModule } from '@angular/material/table';
import { map } from 'rxjs';
import type { AuditEventView } from '../../../shared/api/api-schemas';
import { AdminApi } from './admin-api';

/** Sign-ins and failures, tokens created and revoked, role changes and invitations, newest first. */
@Component({
  selector: 'rf-audit-log-page',
  imports: [DatePipe, MatTableModule],
  template: `
    <h1>Audit log</h1>
    <p>The latest 200 events. Passwords and tokens are never recorded.</p>
    <div class="rf-table-scroll" tabindex="0" role="region" aria-label="Audit log">
      <table mat-table [dataSource]="events()" class="rf-audit">
        <ng-container matColumnDef="at">
          <th mat-header-cell *matHeaderCellDef>When</th>
          <td mat-cell *matCellDef="let event">{{ event.at | date: 'medium' }}</td>
        </ng-container>
        <ng-container matColumnDef="action">
          <th mat-header-cell *matHeaderCellDef>What</th>
          <td mat-cell *matCellDef="let event">
            <code [class.rf-failure]="event.action.endsWith('-failed')">{{ event.action }}</code>
          </td>
        </ng-container>
        <ng-container matColumnDef="actor">
          <th mat-header-cell *matHeaderCellDef>By</th>
          <td mat-cell *matCellDef="let event">{{ event.actorEmail ?? '' }}</td>
        </ng-container>
        <ng-container matColumnDef="subject">
          <th mat-header-cell *matHeaderCellDef>Account or address</th>
          <td mat-cell *matCellDef="let event">{{ event.subjectEmail ?? event.email ?? '' }}</td>
        </ng-container>
        <ng-container matColumnDef="detail">
          <th mat-header-cell *matHeaderCellDef>Detail</th>
          <td mat-cell *matCellDef="let event">{{ event.detail ?? '' }}</td>
        </ng-container>
        <ng-container matColumnDef="ip">
          <th mat-header-cell *matHeaderCellDef>From</th>
          <td mat-cell *matCellDef="let event">{{ event.ip ?? '' }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
    </div>
  `,
  styles: `
    h1 {
      color: var(--rf-water-deep);
    }
    .rf-audit {
      width: 100%;
    }
    .rf-failure {
      color: var(--rf-copper);
      font-weight: 700;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditLogPage {
  protected readonly columns = ['at', 'action', 'actor', 'subject', 'detail', 'ip'];
  protected readonly events = toSignal(
    inject(AdminApi)
      .listAuditEvents()
      .pipe(map(({ events }) => events)),
    { initialValue: [] as AuditEventView[] },
  );
}
