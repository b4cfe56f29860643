import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, RouterLink } from '@angular/router';
import type {
  ChoiceOutcome,
  ProjectRecheck,
  ProjectRevisionView,
  RevisionComparison,
} from '../../../../shared/api/api-schemas';
import { describeHttpError } from '../../core/problem-details';
import { ProjectsApi } from './projects-api';
import { RecordVisitForm } from './record-visit-form';
import { FigurePipe } from '../../shared/locale-numbers';

/**
 * One project's site visits: each revision with its date, author and notes; for any two, what
 * changed and what that did to the system and the chosen pump, as the server works it out; and
 * the re-check of the chosen pump against today's catalog.
 */
@Component({
  selector: 'rf-project-history-page',
  imports: [
    DatePipe,
    FigurePipe,
    FormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatSelectModule,
    RecordVisitForm,
    RouterLink,
  ],
  template: `
    <section class="rf-card" aria-labelledby="rf-history-title">
      <h2 id="rf-history-title">Site visits of this project</h2>
      <p>
        <a routerLink="/design/projects">Back to the projects</a> ·
        <a [routerLink]="['/design/projects', projectId, 'proposal']">Send the proposal</a>
      </p>
      @if (revisions() === null) {
        <p>Loading…</p>
      } @else {
        <table class="rf-table" aria-label="Revisions">
          <thead>
            <tr>
              <th scope="col">Revision</th>
              <th scope="col">Visited on</th>
              <th scope="col">By</th>
              <th scope="col">Notes</th>
              <th scope="col">Chosen pump</th>
              <th scope="col">Saved</th>
            </tr>
          </thead>
          <tbody>
            @for (revision of revisions(); track revision.number) {
              <tr>
                <td>{{ revision.number }}</td>
                <td>{{ revision.visitedOn }}</td>
                <td>{{ revision.author?.name ?? '-' }}</td>
                <td class="rf-notes">{{ revision.notes ?? '' }}</td>
                <td>{{ choiceText(revision) }}</td>
                <td>{{ revision.savedAt | date: 'medium' }}</td>
              </tr>
            }
          </tbody>
        </table>
        @if (revisions()!.length > 1) {
          <h3>Compare two visits</h3>
          <div class="rf-compare-pick">
            <mat-form-field appearance="outline">
              <mat-label>From revision</mat-label>
              <mat-select [(ngModel)]="from" name="from">
                @for (revision of revisions(); track revision.number) {
                  <mat-option [value]="revision.number">{{ revision.number }} ({{ revision.visitedOn }})</mat-option>
                }
              </mat-select>
            </mat-form-field>
            <mat-form-field appearance="outline">
              <mat-label>To revision</mat-label>
              <mat-select [(ngModel)]="to" name="to">
                @for (revision of revisions(); track revision.number) {
                  <mat-option [value]="revision.number">{{ revision.number }} ({{ revision.visitedOn }})</mat-option>
                }
              </mat-select>
            </mat-form-field>
            <button mat-flat-button type="button" (click)="compare()">Compare</button>
          </div>
        }
        @if (comparison(); as shown) {
          <h4>What changed from revision {{ shown.from }} to {{ shown.to }}</h4>
          @if (shown.changes.length === 0) {
            <p>Nothing was measured differently.</p>
          } @else {
            <table class="rf-table" aria-label="Changes">
              <thead>
                <tr>
                  <th scope="col">Value</th>
                  <th scope="col">Revision {{ shown.from }}</th>
                  <th scope="col">Revision {{ shown.to }}</th>
                </tr>
              </thead>
              <tbody>
                @for (change of shown.changes; track change.pointer) {
                  <tr>
                    <td>{{ change.pointer }}</td>
                    <td>{{ change.from ?? 'none' }}</td>
                    <td>{{ change.to ?? 'none' }}</td>
                  </tr>
                }
              </tbody>
            </table>
          }
          <h4>What it did</h4>
          <table class="rf-table" aria-label="Effect">
            <thead>
              <tr>
                <th scope="col"></th>
                <th scope="col">Revision {{ shown.from }}</th>
                <th scope="col">Revision {{ shown.to }}</th>
              </tr>
            </thead>
            <tbody>
              @for (point of shown.after.systemHead; track $index) {
                <tr>
                  <th scope="row">TDH at {{ point.flow | figure: '1.0-1' }} {{ shown.after.units.flow }}</th>
                  <td>{{ shown.before.systemHead[$index].head | figure: '1.2-2' }} {{ shown.after.units.head }}</td>
                  <td>{{ point.head | figure: '1.2-2' }} {{ shown.after.units.head }}</td>
                </tr>
              }
              @if (shown.after.choice && shown.before.choice) {
                <tr>
                  <th scope="row">Operating point</th>
                  <td>{{ pointText(shown.before.choice, shown.after.units) }}</td>
                  <td>{{ pointText(shown.after.choice, shown.after.units) }}</td>
                </tr>
                <tr>
                  <th scope="row">In the band</th>
                  <td>{{ shown.before.choice.inBand ? 'yes' : 'no' }}</td>
                  <td>{{ shown.after.choice.inBand ? 'yes' : 'no' }}</td>
                </tr>
                <tr>
                  <th scope="row">Region</th>
                  <td>{{ shown.before.choice.region ?? 'none' }}</td>
                  <td>{{ shown.after.choice.region ?? 'none' }}</td>
                </tr>
                <tr>
                  <th scope="row">Redundant</th>
                  <td>{{ shown.before.choice.redundant ? 'yes' : 'no' }}</td>
                  <td>{{ shown.after.choice.redundant ? 'yes' : 'no' }}</td>
                </tr>
              }
            </tbody>
          </table>
        }
        <rf-record-visit-form [projectId]="projectId" (recorded)="reload()" />
        @if (hasChoice()) {
          <h3>Re-check against the current catalog</h3>
          <button mat-stroked-button type="button" (click)="recheck()">Re-check</button>
          @if (recheckAnswer(); as answer) {
            <p class="rf-recheck" role="status">{{ answer.summary }}</p>
          }
        }
      }
      @if (problem(); as message) {
        <p class="rf-problem" role="alert">{{ message }}</p>
      }
    </section>
  `,
  styleUrls: ['../design-page.scss'],
  styles: `
    .rf-table {
      width: 100%;
      border-collapse: collapse;
      margin-bottom: 1rem;
      th,
      td {
        padding: 0.35rem 0.5rem;
        border-bottom: 1px solid #e4ddd0;
        text-align: left;
      }
    }
    .rf-notes {
      white-space: pre-line;
    }
    .rf-compare-pick {
      display: flex;
      flex-wrap: wrap;
      gap: 0.75rem;
      align-items: baseline;
    }
    .rf-problem {
      color: #8a3b12;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectHistoryPage {
  private readonly api = inject(ProjectsApi);
  protected readonly projectId = Number(inject(ActivatedRoute).snapshot.paramMap.get('projectId'));
  protected readonly revisions = signal<ProjectRevisionView[] | null>(null);
  protected readonly comparison = signal<RevisionComparison | null>(null);
  protected readonly recheckAnswer = signal<ProjectRecheck | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly hasChoice = computed(() => this.revisions()?.at(-1)?.choice != null);
  protected from = 1;
  protected to = 1;

  constructor() {
    this.reload();
  }

  protected reload(): void {
    this.api.listProjectRevisions(this.projectId).subscribe(({ revisions }) => {
      this.revisions.set(revisions);
      // the last visit against the one before it, the question asked most
      this.to = revisions.length;
      this.from = Math.max(1, revisions.length - 1);
    });
  }

  protected choiceText(revision: ProjectRevisionView): string {
    const choice = revision.choice;
    if (!choice) return '-';
    const { installed, running } = choice.arrangement;
    return `${choice.modelCode}, ${running} running of ${installed} (curve revision ${choice.curveRevisionNumber})`;
  }

  protected pointText(outcome: ChoiceOutcome, units: RevisionComparison['after']['units']): string {
    const point = outcome.operatingPoint;
    return point ? `${point.flow.toFixed(1)} ${units.flow} at ${point.head.toFixed(2)} ${units.head}` : 'no point';
  }

  protected compare(): void {
    this.problem.set(null);
    this.api.compareProjectRevisions(this.projectId, this.from, this.to).subscribe({
      next: (comparison) => this.comparison.set(comparison),
      error: (error: HttpErrorResponse) => this.problem.set(describeHttpError(error)),
    });
  }

  protected recheck(): void {
    this.problem.set(null);
    this.api.recheckProject(this.projectId).subscribe({
      next: (answer) => this.recheckAnswer.set(answer),
      error: (error: HttpErrorResponse) => this.problem.set(describeHttpError(error)),
    });
  }
}
