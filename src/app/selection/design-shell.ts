import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { CautionsPanel } from './cautions-panel';
import { SelectionDraft } from './selection-draft';
import { unitSystems, type UnitSystem } from './unit-systems';

interface DesignStep {
  path: string;
  label: string;
  icon: string;
}

/** The designer's flow in one place: five steps over one draft, with the cautions always in view. */
@Component({
  selector: 'rf-design-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatIconModule, MatButtonToggleModule, CautionsPanel],
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
    <!-- A step's form is built from the draft: a change of units builds it again, in the new units. -->
    @for (units of [draft.unitSystem()]; track units) {
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
    /* on paper: the report and the cautions, not the controls */
    @media print {
      .rf-design-head,
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
  protected readonly unitChoices = (Object.keys(unitSystems) as UnitSystem[]).map((id) => ({ id, label: unitSystems[id].label }));
  protected readonly steps: readonly DesignStep[] = [
    { path: 'system', label: 'Site & system', icon: 'landscape' },
    { path: 'band', label: 'Flow band', icon: 'waves' },
    { path: 'candidates', label: 'Candidates', icon: 'format_list_numbered' },
    { path: 'compare', label: 'Compare', icon: 'stacked_line_chart' },
    { path: 'report', label: 'Report', icon: 'description' },
  ];

  protected setUnits(unitSystem: UnitSystem): void {
    this.draft.setUnitSystem(unitSystem);
  }
}
