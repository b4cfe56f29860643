import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ProjectChoiceInput } from '../../../../shared/api/api-schemas';
import { describeHttpError } from '../../core/problem-details';
import { candidateKey, SelectionDraft } from '../selection-draft';
import { ProjectTags } from './project-tags';
import { ProjectsApi } from './projects-api';

/** The choice kept as it was. */
const keepChoice = 'keep';

/**
 * Saves the design in progress into its project as a site visit: the day, notes, and the
 * candidate chosen from the last search, on the revision this tab opened.
 */
@Component({
  selector: 'rf-record-visit-form',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    <h3>Record the design in progress as a site visit</h3>
    <form [formGroup]="form" (ngSubmit)="record()" novalidate class="rf-visit-form">
      <mat-form-field appearance="outline">
        <mat-label>Visited on</mat-label>
        <input matInput type="date" formControlName="visitedOn" />
      </mat-form-field>
      <mat-form-field appearance="outline" class="rf-visit-notes">
        <mat-label>Notes</mat-label>
        <textarea matInput formControlName="notes" rows="2" maxlength="2000"></textarea>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Chosen pump</mat-label>
        <mat-select formControlName="choice">
          <mat-option [value]="keep">As chosen before</mat-option>
          @for (candidate of candidates(); track candidate.key) {
            <mat-option [value]="candidate.key">{{ candidate.label }}</mat-option>
          }
        </mat-select>
      </mat-form-field>
      <button mat-flat-button type="submit" [disabled]="saving()">Record visit</button>
    </form>
    @if (problem(); as message) {
      <p class="rf-problem" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    .rf-visit-form {
      display: flex;
      flex-wrap: wrap;
      gap: 0.75rem;
      align-items: baseline;
    }
    .rf-visit-notes {
      min-width: min(24rem, 100%);
    }
    .rf-problem {
      color: #8a3b12;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordVisitForm {
  private readonly api = inject(ProjectsApi);
  private readonly draft = inject(SelectionDraft);
  private readonly tags = inject(ProjectTags);
  readonly projectId = input.required<number>();
  readonly recorded = output<void>();
  protected readonly keep = keepChoice;
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    visitedOn: [new Date().toISOString().slice(0, 10), Validators.required],
    notes: [''],
    choice: [keepChoice],
  });
  /** The last search's candidates, when the draft is this project. */
  protected readonly candidates = computed(() =>
    this.draft.project()?.id === this.projectId()
      ? (this.draft.results()?.candidates ?? []).map((candidate) => ({
          key: candidateKey(candidate),
          label: `${candidate.rank}. ${candidate.modelCode}, ${candidate.arrangement.running} running of ${candidate.arrangement.installed}`,
          choice: {
            pumpId: candidate.pumpId,
            arrangement: candidate.arrangement,
            speedRpm: candidate.speed ? Math.round(candidate.speed.rpm) : null,
          } as ProjectChoiceInput,
        }))
      : [],
  );

  protected record(): void {
    const project = this.draft.project();
    if (project?.id !== this.projectId()) {
      this.problem.set('Open this project in the design pages first: the visit records the design in progress.');
      return;
    }
    const { visitedOn, notes, choice } = this.form.getRawValue();
    const chosen = this.candidates().find((candidate) => candidate.key === choice)?.choice;
    this.saving.set(true);
    this.problem.set(null);
    this.api
      .updateProject(
        project.id,
        {
          name: project.name,
          design: this.draft.design(),
          visit: { visitedOn, notes: notes.trim() || null },
          ...(chosen ? { choice: chosen } : {}),
        },
        this.tags.of(project.id),
      )
      .subscribe({
        next: ({ etag }) => {
          this.saving.set(false);
          this.tags.remember(project.id, etag);
          this.form.controls.notes.setValue('');
          this.recorded.emit();
        },
        error: (error: HttpErrorResponse) => {
          this.saving.set(false);
          this.problem.set(
            error.status === 412
              ? 'The project was saved elsewhere since you opened it: open it again from the projects, or save yours as a new project.'
              : describeHttpError(error),
          );
        },
      });
  }
}
