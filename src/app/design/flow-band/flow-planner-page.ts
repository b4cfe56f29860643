import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
  type AbstractControl,
  type ValidationErrors,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { Router } from '@angular/router';
import { map, startWith } from 'rxjs';
import { aboveZero, plausibleValidator } from '../plausible-inputs';
import { SelectionDraft } from '../selection-draft';
import { unitSystems, type UnitSystem } from '../unit-systems';
import { bandFromModules, bandFromTurnover, bandFromWeir, weirSheets, type FlowBand } from './flow-plans';
import { DecimalInput, FigurePipe } from '../../shared/locale-numbers';

type PlanMethod = 'modules' | 'turnover' | 'weir';

/**
 * Where the planner's fields start, in each unit system's own numbers (invented, roughly the same
 * small pond in both): per-module flow, pond volume, weir width.
 */
const planStarts: Readonly<
  Record<UnitSystem, { perModuleMin: number; perModuleMax: number; volume: number; weirWidth: number }>
> = {
  us: { perModuleMin: 30, perModuleMax: 45, volume: 6000, weirWidth: 36 },
  si: { perModuleMin: 115, perModuleMax: 170, volume: 23, weirWidth: 900 },
};

/** The band's minimum may not exceed its maximum. */
function bandInOrder(group: AbstractControl): ValidationErrors | null {
  const { flowMin, flowMax } = group.value as FlowBand;
  return flowMin > flowMax ? { bandOrder: true } : null;
}

/** Step 2: the duty band from the filtration plan, by one of three rules of thumb, or typed in. */
@Component({
  selector: 'rf-flow-planner-page',
  imports: [
    FigurePipe,
    DecimalInput,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatRadioModule,
    MatSelectModule,
  ],
  templateUrl: './flow-planner-page.html',
  styleUrls: ['../design-page.scss', './flow-planner-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FlowPlannerPage {
  private readonly formBuilder = inject(NonNullableFormBuilder);
  private readonly router = inject(Router);
  protected readonly draft = inject(SelectionDraft);
  protected readonly units = this.draft.units;
  protected readonly definition = computed(() => unitSystems[this.draft.unitSystem()]);
  protected readonly sheets = weirSheets;
  protected readonly sheetEnds = [
    { control: 'sheetMin', label: 'Sheet, least' },
    { control: 'sheetMax', label: 'Sheet, most' },
  ] as const;

  private readonly starts = planStarts[this.draft.unitSystem()];

  protected readonly plan = this.formBuilder.group({
    method: this.formBuilder.control<PlanMethod>('modules'),
    moduleCount: this.formBuilder.control(3, [
      Validators.required,
      Validators.min(1),
      Validators.max(200),
      Validators.pattern(/^\d+$/),
    ]),
    perModuleMin: this.formBuilder.control(this.starts.perModuleMin, [Validators.required, Validators.min(0.01)]),
    perModuleMax: this.formBuilder.control(this.starts.perModuleMax, [Validators.required, Validators.min(0.01)]),
    volume: this.formBuilder.control(this.starts.volume, [Validators.required, Validators.min(0.01)]),
    turnoversMin: this.formBuilder.control(1, [Validators.required, Validators.min(0.1), Validators.max(12)]),
    turnoversMax: this.formBuilder.control(2, [Validators.required, Validators.min(0.1), Validators.max(12)]),
    weirWidth: this.formBuilder.control(this.starts.weirWidth, [Validators.required, Validators.min(0.01)]),
    sheetMin: this.formBuilder.control<string>('average'),
    sheetMax: this.formBuilder.control<string>('heavy'),
  });

  /** The search's own checks on a band flow: the contract's floor and the plausible ceiling, in the draft's units. */
  private readonly flowValidators = [Validators.required, aboveZero, plausibleValidator('flow', this.units)];

  protected readonly band = this.formBuilder.group(
    {
      flowMin: this.formBuilder.control(this.draft.band().flowMin, this.flowValidators),
      flowMax: this.formBuilder.control(this.draft.band().flowMax, this.flowValidators),
    },
    { validators: bandInOrder },
  );

  private readonly planValue = toSignal(
    this.plan.valueChanges.pipe(
      startWith(null),
      map(() => this.plan.getRawValue()),
    ),
    {
      initialValue: this.plan.getRawValue(),
    },
  );

  /** The band the chosen rule gives, or null while its fields are incomplete. */
  protected readonly suggestion = computed((): FlowBand | null => {
    const plan = this.planValue();
    const flowUnit = this.units().flow;
    const rate = (id: string) => weirSheets.find((sheet) => sheet.id === id)?.gphPerInch ?? 100;
    const fields = {
      modules: ['moduleCount', 'perModuleMin', 'perModuleMax'],
      turnover: ['volume', 'turnoversMin', 'turnoversMax'],
      weir: ['weirWidth'],
    }[plan.method];
    if (fields.some((field) => this.plan.get(field)?.invalid)) return null;
    const band =
      plan.method === 'modules'
        ? bandFromModules(plan.moduleCount, plan.perModuleMin, plan.perModuleMax)
        : plan.method === 'turnover'
          ? bandFromTurnover(plan.volume, this.definition().volume, plan.turnoversMin, plan.turnoversMax, flowUnit)
          : bandFromWeir(
              plan.weirWidth,
              this.definition().weirWidth,
              rate(plan.sheetMin),
              rate(plan.sheetMax),
              flowUnit,
            );
    return { flowMin: Math.min(band.flowMin, band.flowMax), flowMax: Math.max(band.flowMin, band.flowMax) };
  });

  protected useSuggestion(): void {
    const suggestion = this.suggestion();
    if (!suggestion) return;
    const round = (value: number) => Math.round(value * 10) / 10;
    this.band.setValue({ flowMin: round(suggestion.flowMin), flowMax: round(suggestion.flowMax) });
  }

  protected saveAndSearch(): void {
    this.band.markAllAsTouched();
    if (this.band.invalid) return;
    this.draft.setBand(this.band.getRawValue());
    void this.router.navigate(['/design/candidates']);
  }
}
