import { HttpErrorResponse } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  Injector,
  afterNextRender,
  computed,
  inject,
  linkedSignal,
  signal,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, skip } from 'rxjs';
import { describeHttpError } from '../core/problem-details';
import { SessionService } from '../core/session-service';
import { CautionsPanel } from './cautions-panel';
import { ProjectTags } from './projects/project-tags';
import { ProjectsApi } from './projects/projects-api';
import { SaveConflictDialog, type SaveConflictChoice } from './projects/save-conflict-dialog';
import { SaveProjectDialog } from './projects/save-project-dialog';
import { SelectionDraft } from './selection-draft';
import { unitSystems, type UnitSystem } from './unit-systems';

interface DesignStep {
  path: string;
  label: string;
  icon: string;
}

/** The designer's flow in one place: five steps over one draft, saved as a project, with the cautions always in view. */
@Component({
  selector: 'rf-design-shell',
  imports: [
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    MatIconModule,
    MatButtonModule,
    MatButtonToggleModule,
    CautionsPanel,
  ],
  template: `
    <header class="rf-design-head">
      <h1>Pump selection</h1>
      <mat-button-toggle-group
        [value]="draft.unitSystem()"
        (change)="setUnits($event.value)"
        aria-label="Units of the design"
        hideSingleSelectionIndicator
      >
        @for (choice of unitChoices; track choice.id) {
          <mat-button-toggle [value]="choice.id">{{ choice.label }}</mat-button-toggle>
        }
      </mat-button-toggle-group>
    </header>
    @if (canSave()) {
      <div class="rf-project-bar">
        <span class="rf-project-name"
          ><mat-icon aria-hidden="true">folder</mat-icon> {{ draft.project()?.name ?? 'Unsaved design' }}</span
        >
        <button mat-stroked-button type="button" (click)="save()"><mat-icon>save</mat-icon> Save</button>
        @if (draft.project()) {
          <button mat-button type="button" (click)="saveAsNew()">Save as new</button>
        }
        <a mat-button routerLink="projects" routerLinkActive="rf-step-active"
          ><mat-icon>folder_open</mat-icon> Projects</a
        >
        @if (saveNote(); as note) {
          <span class="rf-save-note" role="status">{{ note }}</span>
        }
      </div>
    }
    <nav class="rf-design-steps" aria-label="Design steps">
      @for (step of steps; track step.path; let index = $index) {
        <a [routerLink]="step.path" routerLinkActive="rf-step-active" ariaCurrentWhenActive="step">
          <span class="rf-step-number">{{ index + 1 }}</span>
          <mat-icon aria-hidden="true">{{ step.icon }}</mat-icon>
          {{ step.label }}
          @if (step.path === 'compare' && comparedCount() > 0) {
            <span class="rf-step-count">({{ comparedCount() }})</span>
          }
        </a>
      }
    </nav>
    <!-- A step's form is built from the draft: a change of units, or the saved project reloaded, builds it again. -->
    @for (form of [draft.unitSystem() + '/' + reloads()]; track form) {
      <router-outlet />
    }
    <rf-cautions-panel />
  `,
  styles: `
    .rf-design-head {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 1rem;
      h1 {
        margin: 0;
        color: var(--rf-water-deep);
      }
    }
    .rf-design-steps {
      display: flex;
      flex-wrap: wrap;
      gap: 0.5rem;
      margin: 1rem 0 1.5rem;
      a {
        display: inline-flex;
        align-items: center;
        gap: 0.4rem;
        padding: 0.45rem 0.9rem;
        border-radius: 999px;
        border: 1px solid var(--rf-water);
        color: var(--rf-water-deep);
        text-decoration: none;
        background: #fff;
      }
      a.rf-step-active {
        background: var(--rf-water-deep);
        color: var(--rf-limestone);
      }
    }
    .rf-step-number {
      font-weight: 700;
    }
    .rf-project-bar {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 0.5rem;
      margin-top: 0.75rem;
    }
    .rf-project-name {
      display: inline-flex;
      align-items: center;
      gap: 0.35rem;
      font-weight: 700;
      color: var(--rf-water-deep);
      margin-right: 0.5rem;
    }
    .rf-save-note {
      color: #3f5f2a;
    }
    /* on paper: the report and the cautions, not the controls */
    @media print {
      .rf-design-head,
      .rf-project-bar,
      .rf-design-steps {
        display: none;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignShell {
  protected readonly draft = inject(SelectionDraft);
  protected readonly comparedCount = computed(() => this.draft.compared().length);
  protected readonly unitChoices = (Object.keys(unitSystems) as UnitSystem[]).map((id) => ({
    id,
    label: unitSystems[id].label,
  }));
  protected readonly steps: readonly DesignStep[] = [
    { path: 'system', label: 'Site & system', icon: 'landscape' },
    { path: 'band', label: 'Flow band', icon: 'waves' },
    { path: 'candidates', label: 'Candidates', icon: 'format_list_numbered' },
    { path: 'compare', label: 'Compare', icon: 'stacked_line_chart' },
    { path: 'report', label: 'Report', icon: 'description' },
  ];

  private readonly projectsApi = inject(ProjectsApi);
  private readonly projectTags = inject(ProjectTags);
  /** How often the saved project replaced the draft on this page, so the step's form is built anew. */
  protected readonly reloads = signal(0);
  private readonly session = inject(SessionService);
  /** Projects are kept for the roles that design: designers, integrators and admins. */
  protected readonly canSave = computed(
    () => this.session.signedIn() && this.session.hasRole(['designer', 'integrator', 'admin']),
  );
  private readonly dialog = inject(MatDialog);
  /** What the last save did, or why it failed; old news, so cleared, once the design changes. */
  protected readonly saveNote = linkedSignal<unknown, string | null>({
    source: () => this.draft.design(),
    computation: () => null,
  });

  constructor() {
    // A new step gets the focus on its heading, so the keyboard and the screen reader start there
    // (the link that led to it is gone); the page's first load leaves the focus alone.
    const host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
    const injector = inject(Injector);
    inject(Router)
      .events.pipe(
        filter((event) => event instanceof NavigationEnd),
        skip(1),
        takeUntilDestroyed(),
      )
      .subscribe(() =>
        afterNextRender(
          () => {
            const heading = host.querySelector<HTMLElement>('h2');
            if (!heading) return;
            heading.tabIndex = -1;
            heading.focus();
          },
          { injector },
        ),
      );
  }

  protected setUnits(unitSystem: UnitSystem): void {
    this.draft.setUnitSystem(unitSystem);
  }

  /**
   * Saves the design again into its project, on the revision this tab opened, or as a new one
   * when it has none. A refusal as stale (412) offers to reload the saved project or save as new.
   */
  protected save(): void {
    const project = this.draft.project();
    if (!project) {
      this.saveAsNew();
      return;
    }
    this.projectsApi
      .updateProject(project.id, { name: project.name, design: this.draft.design() }, this.projectTags.of(project.id))
      .subscribe({
        next: ({ project: saved, etag }) => {
          this.projectTags.remember(saved.id, etag);
          this.saveNote.set(`Saved at ${new Date(saved.updatedAt).toLocaleTimeString()}.`);
        },
        error: (error: HttpErrorResponse) => {
          if (error.status === 412) this.resolveConflict(project.id, project.name);
          else this.saveNote.set(describeHttpError(error));
        },
      });
  }

  private resolveConflict(projectId: number, name: string): void {
    this.dialog
      .open<SaveConflictDialog, string, SaveConflictChoice>(SaveConflictDialog, { width: '32rem', data: name })
      .afterClosed()
      .subscribe((choice) => {
        if (choice === 'save-as-new') this.saveAsNew();
        else if (choice === 'reload')
          this.projectsApi.getProject(projectId).subscribe(({ project, etag }) => {
            this.projectTags.remember(projectId, etag);
            this.draft.openProject(project);
            this.reloads.update((count) => count + 1);
            this.saveNote.set(`Reloaded "${project.name}" as saved (revision ${project.revision}).`);
          });
        else this.saveNote.set('Not saved: the project was saved elsewhere since you opened it.');
      });
  }

  protected saveAsNew(): void {
    this.dialog
      .open(SaveProjectDialog, { width: '32rem', data: this.draft.project()?.name ?? '', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.saveNote.set(`Saved as "${saved.name}".`);
      });
  }
}
