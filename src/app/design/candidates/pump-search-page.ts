import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import {
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
  type AbstractControl,
  type ValidationErrors,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { designSelectionRequest } from '../../../../shared/api/design-system';
import { CalculationsApi } from '../calculations-api';
import { SelectionDraft, type SearchSettings } from '../selection-draft';
import type { RankBy } from '../energy-and-costs';
import { CandidateResults } from './candidate-results';
import { KeptPumpPicker } from './kept-pump-picker';
import type { Subscription } from 'rxjs';
import { kindLabels } from '../../shared/display-units';
import { DecimalInput, FigurePipe } from '../../shared/locale-numbers';

/** At least one arrangement must be ticked. */
function someArrangement(group: AbstractControl): ValidationErrors | null {
  return Object.values(group.value as Record<string, boolean>).some(Boolean) ? null : { noArrangement: true };
}

/** The pump kinds the search may be narrowed to, in the contract's words and the page's. */
const pumpKindChoices = (['submersible', 'external-centrifugal', 'mixed-flow'] as const).map((kind) => ({
  kind,
  label: kindLabels[kind],
}));

/** Step 3: the search over the catalog and its ranked candidates. */
@Component({
  selector: 'rf-pump-search-page',
  imports: [
    FigurePipe,
    DecimalInput,
    ReactiveFormsModule,
    CandidateResults,
    KeptPumpPicker,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSlideToggleModule,
  ],
  templateUrl: './pump-search-page.html',
  styleUrls: ['../design-page.scss', './pump-search-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PumpSearchPage {
  private readonly formBuilder = inject(NonNullableFormBuilder);
  private readonly api = inject(CalculationsApi);
  protected readonly draft = inject(SelectionDraft);
  protected readonly units = this.draft.units;
  protected readonly searching = signal(false);
  protected readonly failed = signal(false);
  protected readonly cancelled = signal(false);
  protected readonly pumpKindChoices = pumpKindChoices;
  private running: Subscription | null = null;

  private readonly settings = this.draft.search();
  protected readonly form = this.formBuilder.group({
    arrangements: this.formBuilder.group(
      {
        one: this.settings.arrangements.includes(1),
        two: this.settings.arrangements.includes(2),
        three: this.settings.arrangements.includes(3),
      },
      { validators: someArrangement },
    ),
    requireOneFailed: this.settings.requireOneFailed,
    standby: this.settings.standby ?? false,
    onlyPreferredRegion: this.settings.onlyPreferredRegion,
    kinds: this.formBuilder.group(
      Object.fromEntries(pumpKindChoices.map(({ kind }) => [kind, this.settings.kinds?.includes(kind) ?? false])),
    ),
    minSolidsMm: this.formBuilder.control<number | null>(this.settings.minSolidsMm ?? null, [
      Validators.min(0.1),
      Validators.max(500),
    ]),
    maxInputPowerPerPump: this.formBuilder.control<number | null>(this.settings.maxInputPowerPerPump, [
      Validators.min(0.001),
    ]),
    hoursPerDay: this.formBuilder.control(this.settings.hoursPerDay, [
      Validators.required,
      Validators.min(0),
      Validators.max(24),
    ]),
    tariffPerKWh: this.formBuilder.control<number | null>(this.settings.tariffPerKWh, [Validators.min(0)]),
    motorEfficiency: this.formBuilder.control<number | null>(this.settings.motorEfficiency ?? null, [
      Validators.min(1),
      Validators.max(100),
    ]),
    rankBy: this.formBuilder.control<RankBy>(this.settings.rankBy ?? 'energy'),
    currency: this.formBuilder.control(this.settings.costs?.currency ?? 'USD', [Validators.pattern(/^[A-Z]{3}$/)]),
    years: this.formBuilder.control(this.settings.costs?.years ?? 15, [
      Validators.required,
      Validators.min(1),
      Validators.max(50),
      Validators.pattern(/^\d+$/),
    ]),
    discountRate: this.formBuilder.control(this.settings.costs?.discountRate ?? 6, [
      Validators.required,
      Validators.min(0),
      Validators.max(50),
    ]),
    energyPriceRise: this.formBuilder.control(this.settings.costs?.energyPriceRise ?? 3, [
      Validators.min(0),
      Validators.max(50),
    ]),
    keepPumpId: this.formBuilder.control<number | null>(this.settings.keepPumpId ?? null),
    limit: this.formBuilder.control(this.settings.limit, [
      Validators.required,
      Validators.min(1),
      Validators.max(200),
      Validators.pattern(/^\d+$/),
    ]),
  });

  protected search(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const value = this.form.getRawValue();
    const settings: SearchSettings = {
      arrangements: [value.arrangements.one && 1, value.arrangements.two && 2, value.arrangements.three && 3].filter(
        (count): count is 1 | 2 | 3 => typeof count === 'number',
      ),
      requireOneFailed: value.requireOneFailed,
      standby: value.standby,
      onlyPreferredRegion: value.onlyPreferredRegion,
      kinds: pumpKindChoices.map(({ kind }) => kind).filter((kind) => value.kinds[kind]),
      minSolidsMm: value.minSolidsMm || null,
      maxInputPowerPerPump: value.maxInputPowerPerPump || null,
      hoursPerDay: value.hoursPerDay,
      tariffPerKWh: value.tariffPerKWh ?? null,
      motorEfficiency: value.motorEfficiency || null,
      rankBy: value.rankBy,
      costs: {
        currency: value.currency,
        years: value.years,
        discountRate: value.discountRate,
        energyPriceRise: value.energyPriceRise ?? 0,
      },
      limit: value.limit,
      ...(value.keepPumpId === null ? {} : { keepPumpId: value.keepPumpId }),
    };
    this.draft.setSearch(settings);
    const body = designSelectionRequest(this.draft.design());
    this.searching.set(true);
    this.failed.set(false);
    this.cancelled.set(false);
    this.running?.unsubscribe();
    this.running = this.api.searchSelections(body).subscribe({
      next: (results) => {
        this.draft.setResults(results);
        this.searching.set(false);
      },
      error: () => {
        this.failed.set(true);
        this.searching.set(false);
      },
    });
  }

  /** Stops waiting for the search (the request is aborted); the results shown before stay. */
  protected cancel(): void {
    this.running?.unsubscribe();
    this.running = null;
    this.searching.set(false);
    this.cancelled.set(true);
  }
}
