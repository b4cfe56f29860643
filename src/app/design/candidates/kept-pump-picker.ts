import { ChangeDetectionStrategy, Component, inject, input, signal, type OnInit } from '@angular/core';
import { ReactiveFormsModule, type FormControl } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import type { PumpSummary } from '../../../../shared/api/api-schemas';
import { CatalogApi } from '../../catalog/catalog-api';

/** A catalog pump as the picker lists it. */
interface KeptChoice {
  id: number;
  label: string;
}

function choiceOf(pump: Pick<PumpSummary, 'id' | 'displayName' | 'modelCode' | 'supplier'>): KeptChoice {
  return { id: pump.id, label: `${pump.displayName} (${pump.modelCode}), ${pump.supplier.name}` };
}

/**
 * "Keep an existing pump": a catalog pump found by its model, or none. The search then looks for
 * one pump to add beside it in parallel.
 */
@Component({
  selector: 'rf-kept-pump-picker',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  template: `
    <fieldset class="rf-group" data-kept-pump>
      <legend>Keep an existing pump</legend>
      <p class="rf-muted">
        A pump already installed stays: the search looks for one pump to run beside it in parallel (the arrangements and
        standby above then do not apply).
      </p>
      <div class="rf-row">
        <mat-form-field>
          <mat-label>Model of the installed pump</mat-label>
          <input
            matInput
            type="search"
            name="keptModel"
            maxlength="80"
            [value]="text()"
            (input)="text.set($any($event.target).value)"
            (keydown.enter)="$event.preventDefault(); find()"
          />
        </mat-form-field>
        <button mat-stroked-button type="button" (click)="find()" [disabled]="text().trim() === ''">
          <mat-icon>search</mat-icon> Find in the catalog
        </button>
        <mat-form-field>
          <mat-label>Pump kept</mat-label>
          <select matNativeControl [formControl]="control()" name="keepPumpId">
            <option [ngValue]="null">None: a new set</option>
            @for (choice of choices(); track choice.id) {
              <option [ngValue]="choice.id">{{ choice.label }}</option>
            }
          </select>
        </mat-form-field>
      </div>
      @if (found() === 0) {
        <p class="rf-muted" role="status">No active catalog pump has that model.</p>
      }
    </fieldset>
  `,
  styleUrls: ['../design-page.scss', './pump-search-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeptPumpPicker implements OnInit {
  private readonly catalog = inject(CatalogApi);
  readonly control = input.required<FormControl<number | null>>();
  protected readonly text = signal('');
  protected readonly choices = signal<KeptChoice[]>([]);
  /** Pumps the last look-up found; null before any. */
  protected readonly found = signal<number | null>(null);

  ngOnInit(): void {
    // a saved design's kept pump is shown by its name
    const kept = this.control().value;
    if (kept !== null)
      this.catalog.getPump(kept).subscribe({
        next: (detail) => this.choices.set([choiceOf(detail.pump)]),
        error: () => this.choices.set([{ id: kept, label: `pump ${kept} (no longer in the catalog)` }]),
      });
  }

  protected find(): void {
    const search = this.text().trim();
    if (search === '') return;
    this.catalog.listPumps({ search, pageSize: 25, sort: 'displayName' }).subscribe((page) => {
      const kept = this.control().value;
      const listed = page.items.map(choiceOf);
      const keptChoice = this.choices().find((choice) => choice.id === kept);
      this.found.set(page.items.length);
      this.choices.set(keptChoice && !listed.some((choice) => choice.id === kept) ? [keptChoice, ...listed] : listed);
    });
  }
}
