import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { Project } from '../../../../shared/api/api-schemas';
import { visibleTextPattern } from '../../accounts/account-validators';
import { describeHttpError } from '../../core/problem-details';
import { SelectionDraft } from '../selection-draft';
import { ProjectTags } from './project-tags';
import { ProjectsApi } from './projects-api';

/** Names the design and saves it as a new project; closes with the saved project or nothing. */
@Component({
  selector: 'rf-save-project-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Save as a new project</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content>
        <mat-form-field appearance="outline" class="rf-wide">
          <mat-label>Project name</mat-label>
          <input matInput formControlName="name" placeholder="Hillside cascade" />
          <mat-hint>The site or the client, so you find it again.</mat-hint>
          @if (form.controls.name.hasError('required')) {
            <mat-error>Give the project a name.</mat-error>
          } @else if (form.controls.name.hasError('maxlength')) {
            <mat-error>Use at most 120 characters.</mat-error>
          } @else if (form.controls.name.hasError('pattern')) {
            <mat-error>Use letters, digits and punctuation, without angle brackets.</mat-error>
          }
        </mat-form-field>
        @if (problem(); as message) {
          <p class="rf-problem" role="alert">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="saving()">Save</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .rf-wide {
      width: min(28rem, 100%);
    }
    .rf-problem {
      color: #8a3b12;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SaveProjectDialog {
  private readonly api = inject(ProjectsApi);
  private readonly draft = inject(SelectionDraft);
  private readonly tags = inject(ProjectTags);
  private readonly dialogRef = inject<MatDialogRef<SaveProjectDialog, Project | undefined>>(MatDialogRef);
  private readonly suggested = inject<string>(MAT_DIALOG_DATA);

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.suggested, [Validators.required, Validators.maxLength(120), Validators.pattern(visibleTextPattern)]],
  });
  protected readonly saving = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.api.createProject({ name: this.form.getRawValue().name, design: this.draft.design() }).subscribe({
      next: ({ project, etag }) => {
        this.tags.remember(project.id, etag);
        this.draft.savedAs(project);
        this.dialogRef.close(project);
      },
      error: (error: HttpErrorResponse) => {
        this.saving.set(false);
        this.problem.set(describeHttpError(error));
      },
    });
  }
}
