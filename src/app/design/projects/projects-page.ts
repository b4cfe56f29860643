import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';
import type { ProjectList } from '../../../../shared/api/api-schemas';
import { SelectionDraft } from '../selection-draft';
import { ProjectTags } from './project-tags';
import { ProjectsApi } from './projects-api';

/** The designer's saved projects: open one to work on it, see its site visits, or delete it. */
@Component({
  selector: 'rf-projects-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, RouterLink],
  template: `
    <section class="rf-card" aria-labelledby="rf-projects-title">
      <h2 id="rf-projects-title">Your saved projects</h2>
      <p class="rf-muted">
        Open a project to re-check it when the site changes; the search runs again on the new numbers.
      </p>
      @if (projects() === null) {
        <p>Loading…</p>
      } @else if (projects()!.length === 0) {
        <p class="rf-empty">No saved projects yet. Use "Save" above on any step of a design.</p>
      } @else {
        <table class="rf-projects">
          <thead>
            <tr>
              <th scope="col">Project</th>
              <th scope="col">Last saved</th>
              <th scope="col"><span class="rf-visually-hidden">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            @for (project of projects(); track project.id) {
              <tr [class.rf-current]="draft.project()?.id === project.id">
                <td>{{ project.name }}</td>
                <td>{{ project.updatedAt | date: 'medium' }}</td>
                <td class="rf-project-actions">
                  <button
                    mat-flat-button
                    type="button"
                    (click)="open(project.id)"
                    [attr.aria-label]="'Open ' + project.name"
                  >
                    Open
                  </button>
                  <a mat-stroked-button [routerLink]="[project.id]" [attr.aria-label]="'History of ' + project.name"
                    >History</a
                  >
                  <a
                    mat-stroked-button
                    [routerLink]="[project.id, 'proposal']"
                    [attr.aria-label]="'Send the proposal of ' + project.name"
                    >Send</a
                  >
                  <button
                    mat-stroked-button
                    type="button"
                    (click)="remove(project.id)"
                    [attr.aria-label]="'Delete ' + project.name"
                  >
                    Delete
                  </button>
                </td>
              </tr>
            }
          </tbody>
        </table>
      }
    </section>
  `,
  styleUrls: ['../design-page.scss'],
  styles: `
    .rf-projects {
      width: 100%;
      border-collapse: collapse;
      th,
      td {
        padding: 0.4rem 0.5rem;
        border-bottom: 1px solid #e4ddd0;
        text-align: left;
      }
    }
    .rf-current td:first-child {
      font-weight: 700;
    }
    .rf-project-actions {
      display: flex;
      gap: 0.5rem;
      justify-content: flex-end;
    }
    .rf-empty {
      font-style: italic;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectsPage {
  private readonly api = inject(ProjectsApi);
  private readonly router = inject(Router);
  private readonly tags = inject(ProjectTags);
  protected readonly draft = inject(SelectionDraft);
  protected readonly projects = signal<ProjectList['projects'] | null>(null);

  constructor() {
    this.reload();
  }

  protected open(projectId: number): void {
    this.api.getProject(projectId).subscribe(({ project, etag }) => {
      this.tags.remember(projectId, etag);
      this.draft.openProject(project);
      void this.router.navigate(['/design/system']);
    });
  }

  protected remove(projectId: number): void {
    this.api.deleteProject(projectId).subscribe(() => {
      if (this.draft.project()?.id === projectId) this.draft.forgetProject();
      this.reload();
    });
  }

  private reload(): void {
    this.api.listProjects().subscribe(({ projects }) => this.projects.set(projects));
  }
}
